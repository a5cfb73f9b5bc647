import "server-only";
import { DEMO_PASSWORD, demoUsers } from "@/db/seed/scenario";
import { ROLE_LABEL } from "./roles";

/** The demo sign-ins, shown on the sign-in page only when the demo scenario is switched on. */
export function demoSignIns() {
  if (process.env.KEELSON_DEMO !== "1") return null;
  return {
    password: DEMO_PASSWORD,
    users: demoUsers.map((u) => ({ email: u.email, label: u.rank ?? ROLE_LABEL[u.role] })),
  };
}
