import { acceptPackage } from "@/server/port-stays/accept";
import { PackageInput } from "@/server/port-stays/contract";
import { withAccess } from "@/server/http/with-access";
import { PortStayParams } from "@/server/http/params";

/** Accepts the package as edited: replaces the stay's items and sets the planned dates. */
export const PUT = withAccess(
  { permission: "work:plan", vessel: true, body: PackageInput, params: PortStayParams },
  ({ access, vessel, params, body }) => acceptPackage(access, vessel, params.stayId, body),
);
