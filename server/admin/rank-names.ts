// The company's own names for Keelson's ranks (Company → Settings).
import "server-only";
import { eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { company } from "@/db/schema";
import type { Access } from "@/server/auth/access";
import { RANKS } from "@/server/routines/ranks";
import { RANK_LABEL, type RankNames, type RankNamesView } from "@/server/routines/rank-names";

export async function loadRankNames(companyId: string): Promise<RankNames> {
  const [row] = await getDb().select({ rankNames: company.rankNames }).from(company).where(eq(company.id, companyId));
  return (row?.rankNames ?? {}) as RankNames;
}

function view(names: RankNames): RankNamesView {
  return { ranks: RANKS.map((rank) => ({ rank, keelson: RANK_LABEL[rank], name: names[rank] ?? null })) };
}

export const loadRankNamesView = async (access: Access) => view(await loadRankNames(access.company.id));

/** Replaces the company's names: a rank left out of `names` takes Keelson's word again. */
export async function saveRankNames(access: Access, names: RankNames): Promise<RankNamesView> {
  await getDb().update(company).set({ rankNames: names }).where(eq(company.id, access.company.id));
  return view(names);
}
