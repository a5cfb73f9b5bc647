import "server-only";
import { notFound } from "next/navigation";
import { type Access, requirePageAccess } from "@/server/auth/access";
import { can } from "@/server/auth/roles";

/**
 * For the company pages: the administrator's access. Anyone else gets the not-found page, as for
 * another company's vessel: a page they may not use is not there for them.
 */
export async function requireCompanyAdmin(): Promise<Access> {
  const access = await requirePageAccess();
  if (!can(access.role, "company:manage")) notFound();
  return access;
}
