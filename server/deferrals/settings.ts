// The company's deferral setting: whether the chief engineer may decide deferrals of work that is
// neither critical nor class-related. Critical and class work always goes to the superintendent.
import "server-only";
import { eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { company } from "@/db/schema";
import type { Access } from "@/server/auth/access";
import type { CompanySettings } from "./contract";

export async function loadCompanySettings(access: Access): Promise<CompanySettings> {
  const [row] = await getDb()
    .select({ chiefDecidesDeferrals: company.chiefDecidesDeferrals })
    .from(company)
    .where(eq(company.id, access.company.id));
  return { chiefDecidesDeferrals: row?.chiefDecidesDeferrals ?? true };
}

/** Requests already pending keep the office flag they were asked with; the decision checks both. */
export async function updateCompanySettings(access: Access, input: CompanySettings): Promise<CompanySettings> {
  const [row] = await getDb()
    .update(company)
    .set({ chiefDecidesDeferrals: input.chiefDecidesDeferrals })
    .where(eq(company.id, access.company.id))
    .returning({ chiefDecidesDeferrals: company.chiefDecidesDeferrals });
  return { chiefDecidesDeferrals: row?.chiefDecidesDeferrals ?? input.chiefDecidesDeferrals };
}
