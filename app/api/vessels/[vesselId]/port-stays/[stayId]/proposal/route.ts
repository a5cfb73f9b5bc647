import { proposePackage } from "@/server/port-stays/proposal";
import { withAccess } from "@/server/http/with-access";
import { PortStayParams } from "@/server/http/params";

/** A proposed work package for the stay, each item with its reason; nothing is written. */
export const POST = withAccess(
  { permission: "work:plan", vessel: true, params: PortStayParams },
  ({ access, vessel, params }) => proposePackage(access, vessel, params.stayId),
);
