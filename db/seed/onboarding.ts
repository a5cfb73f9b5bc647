// A demo vessel brought in as a customer's vessel is: from the spreadsheets of its old plan
// (db/seed/onboarding/<folder>/*.csv), through Keelson's own import — the same checks, the same
// all-or-nothing apply, the record with its files in object storage — so the import path runs every
// time Keelson is set up. The files' days are as of the day they were written (written-on.txt): the seed
// moves the last-done days and the readings forward to today, so the demo's plan stays current.
import { and, eq } from "drizzle-orm";
import { getDb } from "../client";
import * as s from "../schema";
import { shipDay } from "../../server/format/hours";
import { applyImport, fileSource } from "../../server/import/service";
import { onboardingFiles } from "./onboarding-files";
import { demoUsers, demoVessels } from "./scenario";

/** Imports each onboarded demo vessel's files once, as its chief engineer; a vessel with an import already is left alone. */
export async function onboardDemoVessels(companyId: string, now: Date): Promise<void> {
  const db = getDb();
  const [company] = await db.select().from(s.company).where(eq(s.company.id, companyId));
  for (const v of demoVessels.filter((x) => x.onboardedFrom)) {
    const [vessel] = await db.select().from(s.vessel).where(and(eq(s.vessel.companyId, companyId), eq(s.vessel.code, v.code)));
    if (!vessel) continue;
    const [done] = await db.select({ id: s.vesselImport.id }).from(s.vesselImport).where(eq(s.vesselImport.vesselId, vessel.id)).limit(1);
    if (done) continue;
    const chiefEmail = demoUsers.find((u) => u.role === "chief-engineer" && u.vessels.includes(v.code))!.email;
    const [chief] = await db.select().from(s.user).where(eq(s.user.email, chiefEmail));
    const access = {
      user: { id: chief!.id, name: chief!.name, email: chief!.email },
      company: { id: companyId, name: company!.name },
      role: "chief-engineer" as const,
      assignedVesselIds: [vessel.id],
    };
    const files = onboardingFiles(v.onboardedFrom!, shipDay(now, vessel.timeZone));
    try {
      const result = await applyImport(access, vessel, fileSource({ files, retire: false }));
      const c = result.counts;
      console.log(
        `[keelson] ${v.name} onboarded from ${files.length} files: ${c.components.created} components, ${c.counters.created} counters, ` +
          `${c.routines.created} routines, ${c.readings?.created ?? 0} readings`,
      );
    } catch (error) {
      const errors = (error as { errors?: { message: string }[] }).errors;
      if (errors) console.error(`[keelson] ${v.name}: the onboarding files were refused:\n${errors.map((e) => `  ${e.message}`).join("\n")}`);
      throw error;
    }
  }
}
