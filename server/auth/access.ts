import "server-only";
import { headers } from "next/headers";
import { notFound, redirect } from "next/navigation";
import { cache } from "react";
import type { z } from "zod";
import { isUuid } from "@/server/http/ids";
import { AppError } from "@/server/http/problem";
import { resolveAccess } from "./resolve-access";
import { can, type Permission, type Role } from "./roles";

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

/** The signed-in user's access for this request, or null (cached per request). */
export const getAccess = cache(async (): Promise<Access | null> => (await resolveAccess(await headers(), null))?.access ?? null);

const getAccessWithVessel = cache(async (vesselId: string) => resolveAccess(await headers(), vesselId));

export function mayOpenVessel(access: Access, vesselId: string): boolean {
  return access.assignedVesselIds === null || access.assignedVesselIds.includes(vesselId);
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
  if (!isUuid(vesselId)) {
    await requirePageAccess();
    notFound();
  }
  const resolved = await getAccessWithVessel(vesselId);
  if (!resolved) redirect("/sign-in");
  if (!resolved.vessel) notFound();
  return { access: resolved.access, vessel: resolved.vessel };
}

/**
 * For pages with ids in their path beyond the vessel: the parsed ids (`server/http/params.ts`), or
 * the not-found page for a malformed one, as the route handlers answer 404.
 */
export function requirePageParams<S extends z.ZodType>(schema: S, params: unknown): z.output<S> {
  const result = schema.safeParse(params);
  if (!result.success) notFound();
  return result.data;
}
