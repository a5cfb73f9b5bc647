import "server-only";
import { and, eq } from "drizzle-orm";
import { headers } from "next/headers";
import { notFound, redirect } from "next/navigation";
import { cache } from "react";
import { getDb } from "@/db/client";
import { company, membership, vessel, vesselAssignment } from "@/db/schema";
import { isUuid } from "@/server/http/ids";
import { AppError } from "@/server/http/problem";
import { auth } from "./auth";
import { can, type Permission, type Role, seesWholeFleet } from "./roles";

export type Access = {
  user: { id: string; name: string; email: string };
  company: { id: string; name: string };
  role: Role;
  /** Vessel ids this user may open; `null` means every vessel of the company. */
  assignedVesselIds: string[] | null;
};

export type VesselRef = {
  id: string;
  name: string;
  code: string;
  imoNumber: string;
  timeZone: string;
  /** Set when the vessel left the fleet: its records stay readable, nothing on board changes. */
  retiredAt: Date | null;
};

async function loadAccess(requestHeaders: Headers): Promise<Access | null> {
  const session = await auth.api.getSession({ headers: requestHeaders });
  if (!session || session.user.banned) return null;
  const db = getDb();
  const [member] = await db
    .select({ role: membership.role, companyId: company.id, companyName: company.name })
    .from(membership)
    .innerJoin(company, eq(company.id, membership.companyId))
    .where(eq(membership.userId, session.user.id))
    .orderBy(membership.createdAt)
    .limit(1);
  if (!member) return null;
  const assignedVesselIds = seesWholeFleet(member.role)
    ? null
    : (
        await db
          .select({ vesselId: vesselAssignment.vesselId })
          .from(vesselAssignment)
          .where(
            and(
              eq(vesselAssignment.companyId, member.companyId),
              eq(vesselAssignment.userId, session.user.id),
            ),
          )
      ).map((r) => r.vesselId);
  return {
    user: { id: session.user.id, name: session.user.name, email: session.user.email },
    company: { id: member.companyId, name: member.companyName },
    role: member.role,
    assignedVesselIds,
  };
}

/** The signed-in user's access for this request, or null (cached per request). */
export const getAccess = cache(async (): Promise<Access | null> => loadAccess(await headers()));

export function mayOpenVessel(access: Access, vesselId: string): boolean {
  return access.assignedVesselIds === null || access.assignedVesselIds.includes(vesselId);
}

/**
 * A vessel of the signed-in user's company that they may open. Another company's vessel, a vessel
 * they are not assigned to, and a malformed id all look the same from outside: not found.
 */
export async function findAccessibleVessel(access: Access, vesselId: string): Promise<VesselRef | null> {
  if (!isUuid(vesselId) || !mayOpenVessel(access, vesselId)) return null;
  const [row] = await getDb()
    .select({
      id: vessel.id,
      name: vessel.name,
      code: vessel.code,
      imoNumber: vessel.imoNumber,
      timeZone: vessel.timeZone,
      retiredAt: vessel.retiredAt,
    })
    .from(vessel)
    .where(and(eq(vessel.companyId, access.company.id), eq(vessel.id, vesselId)))
    .limit(1);
  return row ?? null;
}

export function assertPermission(access: Access, permission: Permission): void {
  if (!can(access.role, permission)) {
    throw new AppError("forbidden", "Your role does not allow this action.");
  }
}

/** For pages: the signed-in user's access, sending anonymous visitors to sign in. */
export async function requirePageAccess(): Promise<Access> {
  const access = await getAccess();
  if (!access) redirect("/sign-in");
  return access;
}

/** For vessel pages: the vessel, or the not-found page for anything the user may not open. */
export async function requirePageVessel(vesselId: string): Promise<{ access: Access; vessel: VesselRef }> {
  const access = await requirePageAccess();
  const found = await findAccessibleVessel(access, vesselId);
  if (!found) notFound();
  return { access, vessel: found };
}

export { loadAccess };
