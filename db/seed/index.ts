// Seeds the demo scenario once: a second run finds the demo company and changes nothing.
import { randomUUID } from "node:crypto";
import { TZDate } from "@date-fns/tz";
import { addDays, format } from "date-fns";
import { hashPassword } from "better-auth/crypto";
import { eq } from "drizzle-orm";
import { actingAs, systemActor } from "../actor";
import { closeDb, getDb, type Tx } from "../client";
import * as s from "../schema";
import { seedHistory } from "./history";
import { seedLinerWear } from "./liner-wear";
import { onboardDemoVessels } from "./onboarding";
import { seedParts } from "./parts";
import { seedPortStays } from "./port-stays";
import { instantOfShipTime } from "../../server/format/hours";
import { recomputeVessel } from "../../server/scheduling/recompute";
import { seedRoutines, seedTolerancePresets } from "./plan";
import { dailyHours, seededRandom, voyagePattern } from "./readings";
import { componentsFor, countersFor, DEMO_PASSWORD, demoCompany, demoUsers, demoVessels } from "./scenario";

const DAYS = 365;
const READING_CLOCK = "09:00";

export async function seedDemo(now = new Date()): Promise<"created" | "present"> {
  const db = getDb();
  const [existing] = await db.select().from(s.company).where(eq(s.company.slug, demoCompany.slug));
  if (existing) {
    // A start stopped between the demo and its onboarding import finishes the import now.
    await onboardDemoVessels(existing.id, now);
    await seedParts(db, existing.id, now);
    return "present";
  }

  await db.transaction(async (tx) => {
    const [co] = await tx.insert(s.company).values(demoCompany).returning();
    const companyId = co!.id;
    await seedTolerancePresets(tx, companyId);
    const vesselIds = new Map<string, string>();

    for (const v of demoVessels) {
      const [row] = await tx
        .insert(s.vessel)
        .values({ companyId, name: v.name, code: v.code, imoNumber: v.imoNumber, timeZone: v.timeZone })
        .returning();
      const vesselId = row!.id;
      vesselIds.set(v.code, vesselId);

      await seedPortStays(tx, companyId, vesselId, v, now);
      // An onboarded vessel's register, counters, readings and plan come from its files, after this transaction.
      if (v.onboardedFrom) continue;

      const counters = countersFor(v);
      const counterIds = new Map<string, string>();
      for (const [i, c] of counters.entries()) {
        const [cr] = await tx
          .insert(s.counter)
          .values({ companyId, vesselId, name: c.name, plannedHoursPerDay: c.plannedHoursPerDay, sortOrder: i })
          .returning();
        counterIds.set(c.key, cr!.id);
      }

      const componentIds = new Map<string, string>();
      for (const [i, c] of componentsFor(v).entries()) {
        const [cr] = await tx
          .insert(s.component)
          .values({
            companyId,
            vesselId,
            code: c.code,
            name: c.name,
            parentId: c.parent ? componentIds.get(c.parent) : null,
            counterId: c.counter ? counterIds.get(c.counter) : null,
            critical: c.critical ?? false,
            classItemRef: c.classItemRef ?? null,
            maker: c.maker ?? null,
            model: c.model ?? null,
            sortOrder: i,
          })
          .returning();
        componentIds.set(c.code, cr!.id);
      }

      const totals = await seedReadings(tx, companyId, vesselId, v, counters, counterIds, now);
      await seedRoutines(tx, companyId, vesselId, v, componentIds, totals, now);
    }

    const passwordHash = await hashPassword(DEMO_PASSWORD);
    const userIds = new Map<string, string>();
    for (const u of demoUsers) {
      const userId = randomUUID();
      userIds.set(u.email, userId);
      await tx.insert(s.user).values({ id: userId, name: u.name, email: u.email, emailVerified: true, role: "user" });
      await tx.insert(s.account).values({
        id: randomUUID(),
        accountId: userId,
        providerId: "credential",
        userId,
        password: passwordHash,
      });
      await tx.insert(s.membership).values({ companyId, userId, role: u.role, rank: u.rank ?? null });
      for (const code of u.vessels) {
        await tx.insert(s.vesselAssignment).values({ companyId, userId, vesselId: vesselIds.get(code)! });
      }
    }

    // The completed work of the past year, recorded by each vessel's engineer and approved by its chief.
    const engineerOf = (code: string) =>
      demoUsers.find((u) => u.role === "engineer" && u.vessels.includes(code))?.email ?? "";
    const chiefOf = (code: string) =>
      demoUsers.find((u) => u.role === "chief-engineer" && u.vessels.includes(code))?.email ?? "";
    for (const v of demoVessels) {
      await seedHistory(
        tx,
        companyId,
        { id: vesselIds.get(v.code)!, code: v.code, seed: v.seed, timeZone: v.timeZone },
        { doneBy: userIds.get(engineerOf(v.code)) ?? null, decidedBy: userIds.get(chiefOf(v.code)) ?? null },
        now,
      );
    }
    // Aster Gale's liner wear creeping toward its limit over five overhauls: the measurement trends' demo.
    await seedLinerWear(
      tx,
      companyId,
      { id: vesselIds.get("AG")!, code: "AG", seed: demoVessels.find((v) => v.code === "AG")!.seed },
      { doneBy: userIds.get(engineerOf("AG")) ?? null, decidedBy: userIds.get(chiefOf("AG")) ?? null },
      now,
    );
  });
  const [co] = await db.select().from(s.company).where(eq(s.company.slug, demoCompany.slug));
  await onboardDemoVessels(co!.id, now);
  await seedParts(db, co!.id, now);
  await (await import("./defects")).seedDefects(db, co!.id, now);
  // What the worker would write after the readings: rates, work orders and their states.
  for (const v of await db.select().from(s.vessel).where(eq(s.vessel.companyId, co!.id))) {
    const run = await recomputeVessel(db, co!.id, v.id, now);
    if (run.skipped.length)
      console.warn(`[keelson] ${v.code}: ${run.skipped.length} routines skipped`, run.skipped.slice(0, 3));
  }
  await (await import("./deferrals")).seedDeferrals(db, co!.id, now);
  await (await import("./snapshots")).seedSnapshots(db, co!.id, now);
  return "created";
}

/** A year of daily readings at 09:00 ship's time, the last on the ship's day before `now`. */
async function seedReadings(
  tx: Tx,
  companyId: string,
  vesselId: string,
  v: (typeof demoVessels)[number],
  counters: ReturnType<typeof countersFor>,
  counterIds: Map<string, string>,
  now: Date,
) {
  const random = seededRandom(v.seed);
  const atSea = voyagePattern(DAYS + 1, random);
  const today = new TZDate(now, v.timeZone);
  const firstDay = addDays(today, -DAYS);
  const rows: (typeof s.reading.$inferInsert)[] = [];
  const totals = new Map<string, { total: number; hoursPerDay: number }>();

  for (const c of counters) {
    const counterId = counterIds.get(c.key)!;
    const generatorIndex = c.duty === "generator" ? Number(c.key.slice(2)) - 1 : 0;
    const replacementDay = v.meterReplacement?.counter === c.key ? DAYS - v.meterReplacement.daysAgo : -1;
    let total = c.start;
    let segment = 1;
    let offset = 0;
    for (let day = 0; day < DAYS; day++) {
      const shipDay = format(addDays(firstDay, day), "yyyy-MM-dd");
      const readAt = instantOfShipTime(shipDay, READING_CLOCK, v.timeZone);
      if (day > 0)
        total = Math.round((total + dailyHours(c, generatorIndex, v.generators, day, atSea[day]!, random)) * 10) / 10;
      if (day === replacementDay) {
        // The old meter was read at 09:00 and the new one fitted straight after, showing 0.0 h.
        segment = 2;
        offset = total;
        await tx.insert(s.counterSegment).values({
          companyId,
          counterId,
          segment: 2,
          startedAt: readAt,
          startMeter: 0,
          offsetHours: offset,
          reason: "Hour meter failed; replaced with a new meter (demo)",
        });
        rows.push({ companyId, vesselId, counterId, readAt, segment: 1, meterValue: total, totalHours: total });
        continue;
      }
      rows.push({
        companyId,
        vesselId,
        counterId,
        readAt,
        segment,
        meterValue: Math.round((total - offset) * 10) / 10,
        totalHours: total,
      });
    }
    await tx.insert(s.counterSegment).values({
      companyId,
      counterId,
      segment: 1,
      startedAt: instantOfShipTime(format(firstDay, "yyyy-MM-dd"), "00:00", v.timeZone),
      startMeter: c.start,
      offsetHours: 0,
    });
    if (segment === 2) await tx.update(s.counter).set({ currentSegment: 2 }).where(eq(s.counter.id, counterId));
    totals.set(c.key, { total, hoursPerDay: (total - c.start) / DAYS });
  }
  for (let i = 0; i < rows.length; i += 2000) await tx.insert(s.reading).values(rows.slice(i, i + 2000));
  return totals;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const result = await actingAs(systemActor("demo set-up"), () => seedDemo());
  console.log(result === "created" ? "[keelson] demo data seeded" : "[keelson] demo data already present");
  await closeDb();
}
