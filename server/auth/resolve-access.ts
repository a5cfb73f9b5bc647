// The signed-in user's access in one round trip to PostgreSQL: the session (from better-auth's
// signed cookie, checked here with its secret), the user, their company membership, their vessel
// assignments and, for a vessel route, the vessel — one statement instead of four or five. Only a
// session due for better-auth's daily refresh goes through better-auth as well, which extends it.
import "server-only";
import { sql } from "drizzle-orm";
import { getDb } from "@/db/client";
import { auth } from "./auth";
import type { Role } from "./roles";
import { seesWholeFleet } from "./roles";
import type { Access, VesselRef } from "./access";
import { verifiedSessionToken } from "./session-cookie";

export type ResolvedAccess = { access: Access; vessel: VesselRef | null };

type Row = {
  user_id: string;
  user_name: string;
  email: string;
  banned: boolean | null;
  expires_at: Date;
  role: Role;
  company_id: string;
  company_name: string;
  assigned: string[];
  vessel_id: string | null;
  vessel_name: string | null;
  vessel_code: string | null;
  imo_number: string | null;
  time_zone: string | null;
  retired_at: Date | null;
};

/** Resolves who is signed in and, when `vesselId` is given, that vessel if they may open it. */
export async function resolveAccess(headers: Headers, vesselId: string | null): Promise<ResolvedAccess | null> {
  const context = await auth.$context;
  const token = verifiedSessionToken(headers.get("cookie"), context.authCookies.sessionToken.name, context.secret);
  if (!token) return null;

  const result = await getDb().execute<Row>(sql`
    select s.user_id, u.name as user_name, u.email, u.banned, s.expires_at,
           m.role, c.id as company_id, c.name as company_name,
           array(select va.vessel_id::text from vessel_assignment va
                 where va.company_id = m.company_id and va.user_id = s.user_id) as assigned,
           v.id as vessel_id, v.name as vessel_name, v.code as vessel_code, v.imo_number,
           v.time_zone, v.retired_at
      from session s
      join "user" u on u.id = s.user_id
      join lateral (select role, company_id from membership
                     where user_id = s.user_id order by created_at limit 1) m on true
      join company c on c.id = m.company_id
      left join vessel v on v.company_id = m.company_id and v.id = ${vesselId}::uuid
     where s.token = ${token} and s.expires_at > now()`);
  const row = result.rows[0];
  if (!row || row.banned) return null;

  // better-auth extends a session once a day (`updateAge`); that write stays its own.
  const { expiresIn, updateAge } = context.sessionConfig;
  if (new Date(row.expires_at).getTime() - expiresIn * 1000 + updateAge * 1000 <= Date.now()) {
    const refreshed = await auth.api.getSession({ headers });
    if (!refreshed) return null;
  }

  const access: Access = {
    user: { id: row.user_id, name: row.user_name, email: row.email },
    company: { id: row.company_id, name: row.company_name },
    role: row.role,
    assignedVesselIds: seesWholeFleet(row.role) ? null : row.assigned,
  };
  const mayOpen = row.vessel_id !== null && (access.assignedVesselIds?.includes(row.vessel_id) ?? true);
  const vessel: VesselRef | null = mayOpen
    ? {
        id: row.vessel_id!,
        name: row.vessel_name!,
        code: row.vessel_code!,
        imoNumber: row.imo_number!,
        timeZone: row.time_zone!,
        retiredAt: row.retired_at ? new Date(row.retired_at) : null,
      }
    : null;
  return { access, vessel };
}
