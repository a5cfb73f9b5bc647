// The bench's fleet: 51 vessels (the measured one first, then a fleet of 50) of 3,000 routines on 30
// counters, generated from a fixed seed so every run times the same plan. Shared by fleet.ts, which
// times the worker on it, and load.ts, which drives the routes under load on it.
import { existsSync, readFileSync, writeFileSync } from "node:fs";
import { performance } from "node:perf_hooks";
import { eq, sql } from "drizzle-orm";
import type { Db } from "@/db/client";
import * as s from "@/db/schema";

export const FLEET = 50;
export const ROUTINES = 3_000;
const READING_DAYS = 45;
export const DAY = 86_400_000;

// The 30 running-hour counters of a tanker's engine room, and the systems that run no counter.
const COUNTED = [
  ["ME", "Main engine"],
  ["AE1", "Generator 1"],
  ["AE2", "Generator 2"],
  ["AE3", "Generator 3"],
  ["AE4", "Generator 4"],
  ["EG", "Emergency generator"],
  ["AB", "Auxiliary boiler"],
  ["EGB", "Exhaust gas boiler"],
  ["MAC1", "Main air compressor 1"],
  ["MAC2", "Main air compressor 2"],
  ["HFP1", "HFO purifier 1"],
  ["HFP2", "HFO purifier 2"],
  ["LOP1", "ME lube oil purifier"],
  ["LOP2", "AE lube oil purifier"],
  ["FWG", "Fresh water generator"],
  ["STP", "Sewage treatment plant"],
  ["INC", "Incinerator"],
  ["SG1", "Steering gear pump 1"],
  ["SG2", "Steering gear pump 2"],
  ["BT", "Bow thruster"],
  ["BP1", "Ballast pump 1"],
  ["BP2", "Ballast pump 2"],
  ["FP", "Fire pump"],
  ["EFP", "Emergency fire pump"],
  ["CP1", "Cargo pump 1"],
  ["CP2", "Cargo pump 2"],
  ["CP3", "Cargo pump 3"],
  ["CP4", "Cargo pump 4"],
  ["RC", "Provision refrigeration compressor"],
  ["AC", "Air conditioning compressor"],
] as const;
const UNCOUNTED = [
  ["HULL", "Hull and structure"],
  ["DECK", "Deck machinery"],
  ["LSA", "Life-saving appliances"],
  ["FFA", "Fire-fighting appliances"],
  ["NAV", "Navigation equipment"],
  ["ELEC", "Electrical distribution"],
] as const;
const ASSEMBLIES = ["Fuel system", "Lubrication", "Cooling", "Controls"];
const PARTS = ["pump", "filter", "valve"];

// Calendar rules with their length in days, as the tolerance presets measure them.
const CALENDAR = [
  ["FREQ=DAILY", 1],
  ["FREQ=WEEKLY;BYDAY=MO", 7],
  ["FREQ=WEEKLY", 7],
  ["FREQ=MONTHLY", 30.44],
  ["FREQ=MONTHLY;INTERVAL=3", 91.3],
  ["FREQ=MONTHLY;INTERVAL=6", 182.6],
  ["FREQ=YEARLY", 365.25],
  ["FREQ=YEARLY;INTERVAL=2", 730.5],
  ["FREQ=YEARLY;INTERVAL=5", 1826.25],
] as const;
const HOURS = [250, 500, 1_000, 2_000, 3_000, 4_000, 8_000, 12_000];
const RANKS = ["engineer", "motorman", "third-engineer", "second-engineer", "electro-technical-officer", "chief-engineer"];

// A fixed seed: every run of the bench times the same plan.
function random(seed: number) {
  return () => {
    seed = (seed + 0x6d2b79f5) | 0;
    let t = Math.imul(seed ^ (seed >>> 15), 1 | seed);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4_294_967_296;
  };
}
/** How far through its interval a routine stands: mostly early, a quarter due or past due. */
const elapsed = (rnd: () => number) => (rnd() < 0.75 ? 0.1 + rnd() * 0.85 : 0.95 + rnd() * 0.55);
export const day = (d: Date) => d.toISOString().slice(0, 10);
export const seconds = (ms: number) => Math.round(ms / 10) / 100;

function imo(seed: number) {
  const six = String(200000 + seed * 37);
  const sum = [7, 6, 5, 4, 3, 2].reduce((acc, w, i) => acc + w * Number(six[i]), 0);
  return `${six}${sum % 10}`;
}

async function inChunks<T>(rows: T[], size: number, write: (chunk: T[]) => Promise<unknown>) {
  for (let i = 0; i < rows.length; i += size) await write(rows.slice(i, i + size));
}

/** A vessel with its counters, a component tree, 45 days of readings and 3,000 routines. */
async function generateVessel(db: Db, companyId: string, now: Date, n: number) {
  const rnd = random(n + 1);
  const [v] = await db
    .insert(s.vessel)
    .values({
      companyId,
      name: `Fleet tanker ${n}`,
      code: `FL${String(n).padStart(2, "0")}`,
      imoNumber: imo(n),
      timeZone: "UTC",
    })
    .returning();
  const vesselId = v!.id;
  const counters = await db
    .insert(s.counter)
    .values(COUNTED.map(([, name], i) => ({ companyId, vesselId, name, sortOrder: i })))
    .returning();

  // Daily readings; each counter runs its own hours a day, the main engine near 20.
  const readings: (typeof s.reading.$inferInsert)[] = [];
  const latest = new Map<string, number>();
  for (const [ci, c] of counters.entries()) {
    const perDay = 4 + ((ci * 7) % 17);
    const base = 20_000 + ci * 600;
    for (let d = READING_DAYS; d >= 1; d--) {
      const total = base + (READING_DAYS - d) * perDay;
      readings.push({
        companyId,
        vesselId,
        counterId: c.id,
        readAt: new Date(now.getTime() - d * DAY + 3_600_000),
        segment: 1,
        meterValue: total,
        totalHours: total,
      });
      latest.set(c.id, total);
    }
  }
  await inChunks(readings, 5_000, (chunk) => db.insert(s.reading).values(chunk));

  // Systems, their assemblies and parts: a tree three deep; only systems carry a counter.
  const systems = await db
    .insert(s.component)
    .values([
      ...COUNTED.map(([code, name], i) => ({
        companyId,
        vesselId,
        code,
        name,
        counterId: counters[i]!.id,
        sortOrder: i,
      })),
      ...UNCOUNTED.map(([code, name], i) => ({ companyId, vesselId, code, name, sortOrder: COUNTED.length + i })),
    ])
    .returning();
  // Assemblies under each system, parts under each assembly: codes "ME.1", "ME.1.2".
  const childrenOf = (
    parents: typeof systems,
    names: readonly string[],
    name: (parent: string, child: string) => string,
  ) =>
    db
      .insert(s.component)
      .values(
        parents.flatMap((p) =>
          names.map((child, i) => ({
            companyId,
            vesselId,
            parentId: p.id,
            code: `${p.code}.${i + 1}`,
            name: name(p.name, child),
            sortOrder: i,
          })),
        ),
      )
      .returning();
  const assemblies = await childrenOf(systems, ASSEMBLIES, (p, c) => `${p}: ${c}`);
  const parts = await childrenOf(assemblies, PARTS, (p, c) => `${p} ${c}`);
  const all = [...systems, ...assemblies, ...parts];
  const systemOf = new Map<string, string>(systems.map((c) => [c.id, c.id]));
  for (const a of assemblies) systemOf.set(a.id, a.parentId!);
  for (const p of parts) systemOf.set(p.id, systemOf.get(p.parentId!)!);
  const counterOf = new Map(systems.filter((c) => c.counterId).map((c) => [c.id, c.counterId!]));
  const counted = all.filter((c) => counterOf.has(systemOf.get(c.id)!));

  // 40 % hours only, 40 % calendar only, 20 % both; long calendar items half anchored (class items).
  const routines: (typeof s.routine.$inferInsert)[] = [];
  for (let i = 0; i < ROUTINES; i++) {
    const kind = i % 10 < 4 ? "hours" : i % 10 < 8 ? "calendar" : "both";
    const component = kind === "calendar" ? all[i % all.length]! : counted[i % counted.length]!;
    const counterId = counterOf.get(systemOf.get(component.id)!);
    const intervalHours = kind === "calendar" ? null : HOURS[Math.floor(rnd() * HOURS.length)]!;
    const [calendarRule, days] = kind === "hours" ? [null, 0] : CALENDAR[Math.floor(rnd() * CALENDAR.length)]!;
    const anchored = days >= 365 && rnd() < 0.5;
    const calendarElapsed = elapsed(rnd);
    const baselineAt = new Date(now.getTime() - (kind === "hours" ? rnd() * 200 : days * calendarElapsed) * DAY);
    const baselineHours =
      intervalHours && counterId ? Math.round(latest.get(counterId)! - intervalHours * elapsed(rnd)) : null;
    routines.push({
      companyId,
      vesselId,
      componentId: component.id,
      title: `${component.name}: ${kind === "calendar" ? "inspection" : "overhaul"} ${i + 1}`,
      description: "Generated by the fleet benchmark.",
      checklist: ["Isolate and lock out", "Inspect and measure", "Renew worn parts", "Test and record"],
      intervalHours,
      calendarRule,
      anchored,
      anchorDate: anchored ? day(new Date(baselineAt.getTime() + days * DAY)) : null,
      estimatedManHours: 1 + (i % 8),
      rank: RANKS[i % RANKS.length]!,
      needsEngineStop: i % 7 === 0,
      critical: i % 9 === 0,
      classRelated: anchored,
      measurements: i % 5 === 0 ? [{ name: "Clearance", unit: "mm", lower: 0.2, upper: 0.4 }] : [],
      cautions: i % 4 === 0 ? ["isolation"] : [],
      baselineAt,
      baselineHours,
    });
  }
  await inChunks(routines, 1_500, (chunk) => db.insert(s.routine).values(chunk));
  return { vesselId, components: all.length, readings: readings.length };
}

/** Generates the measured vessel and the fleet in one company; the first id is the measured vessel. */
export async function generateFleet(db: Db, companyId: string, now: Date, size = FLEET) {
  const t = performance.now();
  const vessels: string[] = [];
  let components = 0;
  let readings = 0;
  for (let n = 0; n <= size; n++) {
    const g = await generateVessel(db, companyId, now, n);
    vessels.push(g.vesselId);
    components += g.components;
    readings += g.readings;
  }
  // Fresh planner statistics, as autovacuum keeps them on a live database after a bulk load.
  await db.execute(sql`analyze`);
  const generation = {
    seconds: seconds(performance.now() - t),
    vessels: vessels.length,
    routines: vessels.length * ROUTINES,
    components,
    readings,
  };
  console.log(
    `[bench] generated ${generation.vessels} vessels, ${generation.routines} routines, ${components} components, ${readings} readings in ${generation.seconds} s`,
  );
  const [measured, ...fleet] = vessels as [string, ...string[]];
  return { measured, fleet, generation };
}

/** What load.ts needs of the fleet fleet.ts left in the same database: the company and its people. */
export type FleetHandoff = {
  companyId: string;
  measured: string;
  emails: { engineer: string; chiefEngineer: string; superintendent: string };
};
const HANDOFF = "bench-output/fleet-handoff.json";

export function leaveFleet(handoff: FleetHandoff): void {
  writeFileSync(HANDOFF, JSON.stringify(handoff, null, 2));
}

/** The fleet fleet.ts left, if it is in this database (each bench run starts a new one). */
export async function findFleet(db: Db): Promise<FleetHandoff | null> {
  if (!existsSync(HANDOFF)) return null;
  const handoff = JSON.parse(readFileSync(HANDOFF, "utf8")) as FleetHandoff;
  const found = await db.select({ id: s.vessel.id }).from(s.vessel).where(eq(s.vessel.id, handoff.measured));
  return found.length ? handoff : null;
}
