import { checkPackageDraft } from "@/server/port-stays/accept";
import { PackageInput } from "@/server/port-stays/contract";
import { withAccess } from "@/server/http/with-access";
import { PortStayParams } from "@/server/http/params";

/** The package as the timeline has it, checked as accepting would check it; nothing is written. */
export const POST = withAccess(
  { permission: "work:plan", vessel: true, body: PackageInput, params: PortStayParams },
  ({ access, vessel, params, body }) => checkPackageDraft(access, vessel, params.stayId, body),
);
