// Writes the spreadsheets the demo's Sula Meridian is onboarded from (db/seed/onboarding.ts): the
// plan of an invented 6-cylinder two-stroke cargo ship as a company would bring it from its old
// system — the machinery register, counters, routines, a last-done row per routine and a year of
// daily readings — in Keelson's import layout. Run once; the files are committed:
//   node_modules/.bin/tsx scripts/demo-plan.ts
// Intervals and teams are `common practice` demo values (they vary by maker; SOURCES.md, "Running-
// hour facts"); the makers are invented. None of this replaces the maker's manual or class rules.
import { mkdirSync, writeFileSync } from "node:fs";
import path from "node:path";
import { addDays, format, parseISO } from "date-fns";
import Papa from "papaparse";
import { dailyHours, seededRandom, voyagePattern } from "../db/seed/readings";
import { countersFor, demoVessels } from "../db/seed/scenario";
import { LAYOUT, type ImportKind } from "../server/import/layout";

/** The files' days are as of this day: the last reading is the day before. The seed moves them to today. */
const WRITTEN_ON = "2026-12-01";
const DAYS = 365;
const OUT = path.join(import.meta.dirname, "../db/seed/onboarding/sula-meridian");
const vessel = demoVessels.find((v) => v.code === "SM")!;
const random = seededRandom(4101);

type Row = Record<string, string>;
const rows: Record<ImportKind, Row[]> = { components: [], counters: [], routines: [], "last-done": [], readings: [] };

// ── Counters and a year of readings ────────────────────────────────────────────────────────────
const counters = countersFor(vessel);
const counterName = new Map(counters.map((c) => [c.key, c.name]));
/** Each counter's total at 09:00 of each day, day 0 a year before the last. */
const series = new Map<string, number[]>();
{
  const atSea = voyagePattern(DAYS, random);
  const first = addDays(parseISO(WRITTEN_ON), -DAYS);
  for (const c of counters) {
    const generatorIndex = c.duty === "generator" ? Number(c.key.slice(2)) - 1 : 0;
    let total = c.start;
    const totals: number[] = [];
    for (let day = 0; day < DAYS; day += 1) {
      // At most 23 h a day: the seed moves these days to today's calendar, and the day the ship's clocks
      // go forward has 23 h wherever it falls (the Hour log's rule refuses more hours than passed).
      if (day > 0) total = Math.round((total + Math.min(23, dailyHours(c, generatorIndex, vessel.generators, day, atSea[day]!, random))) * 10) / 10;
      totals.push(total);
      rows.readings.push({ counter: c.name, read_at: `${format(addDays(first, day), "yyyy-MM-dd")} 09:00`, value: total.toFixed(1) });
    }
    series.set(c.key, totals);
    rows.counters.push({ counter: c.name, planned_hours_per_day: String(c.plannedHoursPerDay) });
  }
}

// ── The machinery register ─────────────────────────────────────────────────────────────────────
type Component = { code: string; name: string; parent?: string; critical?: boolean; classItem?: string; counter?: string; maker?: string; model?: string };
const components: Component[] = [];
const add = (c: Component) => components.push(c);
const counterOf = new Map<string, string>();

add({ code: "ME", name: "Main engine", critical: true, classItem: "ME", counter: "ME", maker: "Hansen & Vik", model: "HV 6S50" });
for (const [code, name] of [
  ["ME.CYL", "Cylinder units"],
  ["ME.TC", "Turbocharger"],
  ["ME.SA", "Scavenge air system"],
  ["ME.FO", "Fuel oil system"],
  ["ME.LO", "Lubricating oil system"],
  ["ME.CW", "Jacket cooling water system"],
  ["ME.SAIR", "Starting air system"],
  ["ME.GOV", "Governor and control"],
  ["ME.SHAFT", "Shafting and thrust bearing"],
] as const) add({ code, name, parent: "ME", critical: code !== "ME.GOV" ? true : undefined });
for (let i = 1; i <= 6; i += 1) {
  add({ code: `ME.CYL.${i}`, name: `Cylinder unit ${i}`, parent: "ME.CYL", critical: true, classItem: `ME-CU-${i}` });
  add({ code: `ME.CYL.${i}.EV`, name: `Exhaust valve, cylinder ${i}`, parent: `ME.CYL.${i}` });
  add({ code: `ME.CYL.${i}.FV`, name: `Fuel valves, cylinder ${i}`, parent: `ME.CYL.${i}` });
  add({ code: `ME.CYL.${i}.SV`, name: `Starting valve, cylinder ${i}`, parent: `ME.CYL.${i}` });
}
add({ code: "ME.TC.AC", name: "Turbocharger air filter and silencer", parent: "ME.TC" });
add({ code: "ME.SA.COOL", name: "Scavenge air cooler", parent: "ME.SA" });
add({ code: "ME.SA.BLW", name: "Auxiliary blowers", parent: "ME.SA" });
add({ code: "ME.SHAFT.STB", name: "Stern tube bearing and seals", parent: "ME.SHAFT", critical: true, classItem: "SH-ST" });

add({ code: "AE", name: "Generator sets" });
for (let i = 1; i <= vessel.generators; i += 1) {
  const g = `AE.${i}`;
  add({ code: g, name: `Generator set ${i}`, parent: "AE", critical: true, classItem: `AE-${i}`, counter: `AE${i}`, maker: "Halvorsen Diesel", model: "H6L-23" });
  for (const [part, name] of [
    ["CYL", "Cylinder heads and units"],
    ["TC", "Turbocharger"],
    ["FIV", "Fuel injection valves"],
    ["GOV", "Governor"],
    ["ALT", "Alternator"],
    ["LOC", "Lube oil cooler"],
    ["CWP", "Cooling water pump"],
  ] as const) add({ code: `${g}.${part}`, name: `${name}, generator ${i}`, parent: g });
}
add({ code: "EG", name: "Emergency generator", critical: true, classItem: "EG", counter: "EG", maker: "Torvik Power", model: "TP-150" });
add({ code: "EG.BAT", name: "Emergency generator starting batteries", parent: "EG", critical: true });

add({ code: "AIR", name: "Compressed air" });
for (const i of [1, 2]) add({ code: `AIR.C${i}`, name: `Main air compressor ${i}`, parent: "AIR", critical: true, counter: `AC${i}`, maker: "Brisk Kompressor", model: "BK-260" });
for (const i of [1, 2]) add({ code: `AIR.R${i}`, name: `Starting air receiver ${i}`, parent: "AIR", critical: true, classItem: `AR-${i}` });
add({ code: "AIR.SVC", name: "Service air compressor and dryer", parent: "AIR" });

add({ code: "SEP", name: "Separators" });
add({ code: "SEP.FO1", name: "Fuel oil purifier 1", parent: "SEP", counter: "PUF", maker: "Centriva", model: "CV-40" });
add({ code: "SEP.FO2", name: "Fuel oil purifier 2", parent: "SEP", maker: "Centriva", model: "CV-40" });
add({ code: "SEP.LO", name: "Lube oil purifier", parent: "SEP", counter: "PUL", maker: "Centriva", model: "CV-30" });

add({ code: "PMP", name: "Pumps" });
const pumps = [
  ["SW", "Main sea water pump", true],
  ["FWC", "Central fresh water cooling pump", true],
  ["JCW", "Jacket water pump", true],
  ["LO", "Main lube oil pump", true],
  ["FOT", "Fuel oil transfer pump", false],
  ["FOS", "Fuel oil supply pump", true],
  ["FOC", "Fuel oil circulating pump", true],
  ["BAL", "Ballast pump", false],
  ["BLG", "Bilge pump", true],
  ["GS", "General service pump", false],
  ["FW", "Fresh water hydrophore pump", false],
] as const;
for (const [code, name, critical] of pumps) {
  for (const n of [1, 2]) add({ code: `PMP.${code}${n}`, name: `${name} ${n}`, parent: "PMP", critical: critical || undefined, maker: "Nordkap Pumps" });
}
add({ code: "PMP.FIRE", name: "Main fire pump", parent: "PMP", critical: true, classItem: "FF-P1", maker: "Nordkap Pumps" });
add({ code: "PMP.EFP", name: "Emergency fire pump", parent: "PMP", critical: true, classItem: "FF-EP", counter: "EFP", maker: "Nordkap Pumps" });

add({ code: "HX", name: "Heat exchangers" });
for (const [code, name] of [
  ["CFW1", "Central cooler 1"],
  ["CFW2", "Central cooler 2"],
  ["LOC", "Main lube oil cooler"],
  ["JCWC", "Jacket water cooler"],
  ["FOH", "Fuel oil heater"],
] as const) add({ code: `HX.${code}`, name, parent: "HX" });

add({ code: "BLR", name: "Auxiliary boiler", critical: true, classItem: "BLR-1", maker: "Kessel Nord", model: "KN-2000" });
add({ code: "BLR.BRN", name: "Boiler burner", parent: "BLR", critical: true, counter: "BLR" });
add({ code: "BLR.SV", name: "Boiler safety valves", parent: "BLR", critical: true, classItem: "BLR-SV" });
add({ code: "BLR.FWP", name: "Boiler feed water pumps", parent: "BLR" });
add({ code: "BLR.EGE", name: "Exhaust gas economiser", parent: "BLR", classItem: "BLR-EGE" });

add({ code: "SG", name: "Steering gear", critical: true, classItem: "SG", maker: "Helmholt Hydraulics" });
add({ code: "SG.P1", name: "Steering gear pump 1", parent: "SG", critical: true, counter: "SG1" });
add({ code: "SG.P2", name: "Steering gear pump 2", parent: "SG", critical: true });
add({ code: "SG.RAM", name: "Rams and rudder carrier", parent: "SG", critical: true });

add({ code: "ENV", name: "Environmental plant" });
add({ code: "ENV.OWS", name: "Oily water separator and 15 ppm monitor", parent: "ENV", critical: true, classItem: "MP-OWS" });
add({ code: "ENV.STP", name: "Sewage treatment plant", parent: "ENV", classItem: "MP-STP" });
add({ code: "ENV.INC", name: "Incinerator", parent: "ENV" });
add({ code: "ENV.FWG", name: "Fresh water generator", parent: "ENV" });

add({ code: "EL", name: "Electrical" });
add({ code: "EL.MSB", name: "Main switchboard", parent: "EL", critical: true, classItem: "EL-MSB" });
add({ code: "EL.ESB", name: "Emergency switchboard", parent: "EL", critical: true, classItem: "EL-ESB" });
add({ code: "EL.UPS", name: "UPS and 24 V batteries", parent: "EL", critical: true });
add({ code: "EL.SHORE", name: "Shore connection box", parent: "EL" });
for (const n of [1, 2]) add({ code: `EL.TR${n}`, name: `440/230 V transformer ${n}`, parent: "EL" });

add({ code: "SAFE", name: "Safety equipment" });
add({ code: "SAFE.LB", name: "Lifeboat and engine", parent: "SAFE", critical: true, classItem: "LSA-LB", counter: "LB" });
add({ code: "SAFE.DAV", name: "Lifeboat davit and winch", parent: "SAFE", critical: true, classItem: "LSA-DAV" });
add({ code: "SAFE.CO2", name: "Engine room CO2 system", parent: "SAFE", critical: true, classItem: "FF-CO2" });
add({ code: "SAFE.QCV", name: "Quick-closing valves", parent: "SAFE", critical: true });
add({ code: "SAFE.FD", name: "Fire detection system", parent: "SAFE", critical: true, classItem: "FF-FD" });

add({ code: "DECK", name: "Deck machinery" });
for (const [code, name] of [
  ["WIN1", "Windlass forward"],
  ["MOOR1", "Mooring winch 1"],
  ["MOOR2", "Mooring winch 2"],
  ["CRANE", "Provision crane"],
  ["HPU", "Hatch cover hydraulic unit"],
] as const) add({ code: `DECK.${code}`, name, parent: "DECK" });

add({ code: "HVAC", name: "Ventilation and refrigeration" });
for (const [code, name] of [
  ["ERF1", "Engine room supply fan 1"],
  ["ERF2", "Engine room supply fan 2"],
  ["AC", "Accommodation air conditioning"],
  ["PROV", "Provision refrigeration plant"],
] as const) add({ code: `HVAC.${code}`, name, parent: "HVAC" });

for (const c of components) {
  rows.components.push({
    code: c.code,
    name: c.name,
    parent: c.parent ?? "",
    critical: c.critical ? "yes" : "no",
    class_item: c.classItem ?? "",
    counter: c.counter ? counterName.get(c.counter)! : "",
    maker: c.maker ?? "",
    model: c.model ?? "",
  });
}
// The counter each component's hours come from: its own, or the nearest ancestor's.
{
  const byCode = new Map(components.map((c) => [c.code, c]));
  for (const c of components) {
    for (let at: Component | undefined = c; at; at = at.parent ? byCode.get(at.parent) : undefined) {
      if (at.counter) {
        counterOf.set(c.code, at.counter);
        break;
      }
    }
  }
}

// ── Routines ───────────────────────────────────────────────────────────────────────────────────
type Routine = {
  component: string;
  word: string;
  title: string;
  hours?: number;
  every?: string;
  rrule?: string;
  /** "next": an anchored class item, its next anniversary worked out below. */
  anniversary?: "next";
  team: string;
  elapsed: number;
  engineStop?: boolean;
  port?: boolean;
  portEvent?: "departure" | "arrival";
  portEventHours?: number;
  critical?: boolean;
  classRelated?: boolean;
  classItem?: string;
  checklist?: string[];
  measurements?: string;
  parts?: string;
  cautions?: string[];
};
const routines: Routine[] = [];
const r = (x: Routine) => routines.push(x);
const LOCKOUT = ["Isolate and lock out", "Confirm zero energy", "Do the work to the maker's manual", "Restore and test run", "Record findings"];

for (let i = 1; i <= 6; i += 1) {
  const c = `ME.CYL.${i}`;
  r({ component: c, word: "OVERHAUL", title: `Piston overhaul and liner gauging, cylinder ${i}`, hours: 16000, team: "second engineer; motorman x2", elapsed: 14, engineStop: true, critical: true, classRelated: true, classItem: `ME-CU-${i}`, checklist: ["Engage turning gear and block starting air", "Open crankcase and scavenge doors, ventilate", "Pull piston, renew rings", "Gauge liner at the marked positions", "Assemble, tighten to the maker's torque", "Run-in as the maker's manual says"], measurements: "Liner wear [mm] 0..1.6 | Ring groove clearance [mm] 0.35..0.60", parts: "Piston ring set; piston rod stuffing box rings; O-rings", cautions: ["turning-gear", "starting-air", "enclosed-space"] });
  r({ component: c, word: "SCAV", title: `Scavenge port inspection, cylinder ${i}`, hours: 2000, team: "third engineer; motorman", elapsed: 2, engineStop: true, checklist: ["Block starting air, engage turning gear", "Inspect rings, liner and piston crown through the ports", "Record ring condition"], cautions: ["turning-gear", "starting-air"] });
  r({ component: `${c}.EV`, word: "OVERHAUL", title: `Exhaust valve overhaul, cylinder ${i}`, hours: 16000, team: "second engineer; motorman", elapsed: 8, engineStop: true, critical: true, checklist: ["Remove valve, grind seat and spindle", "Measure spindle and seat", "Renew seals", "Refit and pressure-test the air spring"], measurements: "Spindle seat burn-off [mm] ..1.0", parts: "Spindle seal kit; bottom piece O-rings", cautions: ["isolation", "turning-gear"] });
  r({ component: `${c}.FV`, word: "TEST", title: `Fuel valve pressure test, cylinder ${i}`, hours: 4000, team: "third engineer", elapsed: 3, engineStop: true, checklist: ["Remove valves", "Test opening pressure and atomisation on the test pump", "Renew nozzles as found", "Refit"], measurements: "Opening pressure [bar] 340..360", parts: "Nozzles; spindle guides", cautions: ["isolation"] });
  r({ component: `${c}.SV`, word: "CHECK", title: `Starting valve check, cylinder ${i}`, hours: 8000, team: "third engineer", elapsed: 2, engineStop: true, checklist: ["Isolate starting air", "Remove and inspect valve", "Refit with new O-rings"], parts: "O-ring kit", cautions: ["starting-air"] });
}
r({ component: "ME", word: "CRANKCASE", title: "Crankcase inspection and bearing check", every: "every 6 months", team: "second engineer; motorman", elapsed: 4, engineStop: true, critical: true, classRelated: true, classItem: "ME", checklist: ["Stop, block starting air, engage turning gear", "Ventilate the crankcase before entry", "Inspect bearings, bolts, locking devices", "Check deflections"], measurements: "Crankshaft deflection [mm] -0.15..0.15", cautions: ["enclosed-space", "turning-gear", "starting-air"] });
r({ component: "ME", word: "DEFLECTION", title: "Crankshaft deflection readings", hours: 8000, team: "second engineer; motorman", elapsed: 3, engineStop: true, critical: true, measurements: "Deflection unit 1 [mm] -0.15..0.15 | Deflection unit 6 [mm] -0.15..0.15", cautions: ["turning-gear", "enclosed-space"] });
r({ component: "ME", word: "LO-ANALYSIS", title: "System lube oil sample for analysis", every: "every 3 months", team: "fourth engineer", elapsed: 0.5, checklist: ["Draw the sample from the marked point, engine running", "Label and send"] });
r({ component: "ME", word: "SAFETY", title: "Main engine shut-down and slow-down tests", every: "every 3 months", team: "second engineer; electro-technical officer", elapsed: 3, critical: true, classRelated: true, port: true, checklist: ["Simulate each shut-down trip", "Check alarms and indications", "Record"] });
r({ component: "ME", word: "TIEBOLT", title: "Tie bolt and holding-down bolt tension check", hours: 24000, team: "second engineer; motorman x2", elapsed: 10, engineStop: true, critical: true, classRelated: true, classItem: "ME", cautions: ["turning-gear"] });
r({ component: "ME.TC", word: "WASH-T", title: "Turbine dry cleaning", hours: 100, team: "motorman", elapsed: 0.5, checklist: ["At the load the maker gives", "Inject the granulate", "Record exhaust temperatures before and after"] });
r({ component: "ME.TC", word: "WASH-C", title: "Compressor water wash", hours: 250, team: "motorman", elapsed: 0.5 });
r({ component: "ME.TC", word: "OVERHAUL", title: "Turbocharger overhaul", hours: 24000, team: "second engineer; motorman x2", elapsed: 16, engineStop: true, port: true, critical: true, checklist: ["Service engineer attends", "Open, clean, inspect rotor and nozzle ring", "Renew bearings", "Balance check", "Assemble"], parts: "Bearing set; gasket set", cautions: ["isolation"] });
r({ component: "ME.TC.AC", word: "FILTER", title: "Turbocharger air filter cleaning", hours: 1000, team: "motorman", elapsed: 1 });
r({ component: "ME.SA.COOL", word: "CLEAN", title: "Scavenge air cooler cleaning", hours: 6000, team: "third engineer; motorman x2", elapsed: 8, engineStop: true, cautions: ["isolation"] });
r({ component: "ME.SA.COOL", word: "CHEM", title: "Scavenge air cooler chemical cleaning at sea", hours: 1000, team: "motorman", elapsed: 1 });
r({ component: "ME.SA.BLW", word: "CHECK", title: "Auxiliary blower bearing and motor check", every: "every 6 months", team: "electro-technical officer", elapsed: 2, cautions: ["isolation"] });
r({ component: "ME.FO", word: "FILTER", title: "Main engine fuel auto-filter inspection", hours: 2000, team: "third engineer", elapsed: 2, cautions: ["isolation", "hot-work"] });
r({ component: "ME.FO", word: "VIT", title: "Fuel pump timing check", hours: 8000, team: "second engineer", elapsed: 4, engineStop: true });
r({ component: "ME.LO", word: "FILTER", title: "Main lube oil filter inspection", hours: 2000, team: "third engineer; motorman", elapsed: 2, cautions: ["isolation"] });
r({ component: "ME.CW", word: "TREAT", title: "Jacket water treatment test", every: "every week", team: "fourth engineer", elapsed: 0.5, measurements: "Nitrite [ppm] 1000..2400 | pH 8.3..10" });
r({ component: "ME.SAIR", word: "MAINVALVE", title: "Main starting valve overhaul", hours: 12000, team: "second engineer; motorman", elapsed: 5, engineStop: true, cautions: ["starting-air"] });
r({ component: "ME.GOV", word: "CHECK", title: "Governor and speed-control check", every: "every year", team: "second engineer; electro-technical officer", elapsed: 3, port: true });
r({ component: "ME.SHAFT", word: "THRUST", title: "Thrust bearing clearance check", hours: 16000, team: "second engineer; motorman", elapsed: 4, engineStop: true, measurements: "Axial clearance [mm] 0.5..1.2", cautions: ["turning-gear"] });
r({ component: "ME.SHAFT.STB", word: "SEAL", title: "Stern tube seal and oil check", every: "every month", team: "third engineer", elapsed: 1, measurements: "Aft seal oil loss [l/day] ..2" });
r({ component: "ME.SHAFT.STB", word: "SURVEY", title: "Tailshaft survey preparation", every: "every 5 years", anniversary: "next", team: "chief engineer; second engineer", elapsed: 8, port: true, critical: true, classRelated: true, classItem: "SH-ST" });

for (let i = 1; i <= vessel.generators; i += 1) {
  const g = `AE.${i}`;
  r({ component: g, word: "OILCHANGE", title: `Lube oil change, generator ${i}`, hours: 1500, team: "fourth engineer; motorman", elapsed: 3, cautions: ["isolation"], parts: "Lube oil filter elements" });
  r({ component: g, word: "SAMPLE", title: `Lube oil sample for analysis, generator ${i}`, hours: 500, team: "fourth engineer", elapsed: 0.5 });
  r({ component: g, word: "TAPPET", title: `Valve clearance check, generator ${i}`, hours: 2000, team: "third engineer", elapsed: 3, measurements: "Inlet clearance [mm] 0.35..0.45 | Exhaust clearance [mm] 0.75..0.85", cautions: ["isolation", "turning-gear"] });
  r({ component: g, word: "MAJOR", title: `Major overhaul, generator ${i}`, hours: 24000, team: "second engineer; third engineer; motorman x2", elapsed: 40, port: true, critical: true, classRelated: true, classItem: `AE-${i}`, checklist: ["Pull all units", "Measure liners and bearings", "Renew as worn", "Assemble and run-in"], measurements: "Liner wear [mm] ..0.6", parts: "Overhaul kit per unit", cautions: ["isolation", "turning-gear"] });
  r({ component: g, word: "CRANKCASE", title: `Crankcase inspection, generator ${i}`, hours: 6000, team: "third engineer; motorman", elapsed: 3, cautions: ["isolation", "turning-gear", "enclosed-space"], measurements: "Main bearing clearance [mm] ..0.25" });
  r({ component: g, word: "AIRSTART", title: `Air starter and starting air filter check, generator ${i}`, every: "every 6 months", team: "motorman", elapsed: 1, cautions: ["starting-air"] });
  r({ component: g, word: "SAFETY", title: `Safety device test, generator ${i}`, every: "every 3 months", team: "third engineer; electro-technical officer", elapsed: 2, critical: true, classRelated: true });
  r({ component: `${g}.CYL`, word: "HEADS", title: `Cylinder head overhaul, generator ${i}`, hours: 12000, team: "third engineer; motorman x2", elapsed: 16, port: true, parts: "Valve and seat rings; gaskets", cautions: ["isolation"] });
  r({ component: `${g}.TC`, word: "WASH", title: `Turbocharger wash, generator ${i}`, hours: 250, team: "motorman", elapsed: 0.5 });
  r({ component: `${g}.TC`, word: "OVERHAUL", title: `Turbocharger overhaul, generator ${i}`, hours: 16000, team: "third engineer; motorman", elapsed: 10, port: true, cautions: ["isolation"] });
  r({ component: `${g}.FIV`, word: "TEST", title: `Injection valve test, generator ${i}`, hours: 3000, team: "third engineer", elapsed: 3, measurements: "Opening pressure [bar] 350..370", cautions: ["isolation"] });
  r({ component: `${g}.GOV`, word: "OIL", title: `Governor oil change, generator ${i}`, hours: 6000, team: "fourth engineer", elapsed: 1 });
  r({ component: `${g}.ALT`, word: "INSUL", title: `Alternator insulation and bearing check, generator ${i}`, every: "every year", team: "electro-technical officer", elapsed: 3, measurements: "Insulation resistance [MΩ] 1..", cautions: ["isolation"] });
  r({ component: `${g}.LOC`, word: "CLEAN", title: `Lube oil cooler cleaning, generator ${i}`, hours: 8000, team: "third engineer; motorman", elapsed: 5, cautions: ["isolation"] });
  r({ component: `${g}.CWP`, word: "SEAL", title: `Cooling water pump seal check, generator ${i}`, hours: 6000, team: "motorman", elapsed: 2 });
}
r({ component: "EG", word: "TEST", title: "Emergency generator load test", every: "every week on Saturday", team: "third engineer", elapsed: 1, critical: true, classRelated: true, checklist: ["Start on each starting means", "Run on load", "Record"] });
r({ component: "EG", word: "AUTOSTART", title: "Emergency generator automatic start and blackout test", every: "every month", team: "third engineer; electro-technical officer", elapsed: 2, critical: true, classRelated: true, port: true });
r({ component: "EG", word: "OILCHANGE", title: "Emergency generator oil and filters", every: "every year", team: "fourth engineer", elapsed: 3, parts: "Oil filter; fuel filter; air filter" });
r({ component: "EG.BAT", word: "CHECK", title: "Starting battery check", every: "every week", team: "electro-technical officer", elapsed: 0.5, measurements: "Cell voltage [V] 2.1..2.3" });

for (const i of [1, 2]) {
  const c = `AIR.C${i}`;
  r({ component: c, word: "VALVES", title: `Compressor valve overhaul, compressor ${i}`, hours: 1000, team: "fourth engineer; motorman", elapsed: 4, parts: "Valve repair kits, first and second stage", cautions: ["isolation"] });
  r({ component: c, word: "OIL", title: `Compressor crankcase oil change, compressor ${i}`, hours: 500, team: "motorman", elapsed: 1 });
  r({ component: c, word: "MAJOR", title: `Compressor major overhaul, compressor ${i}`, hours: 6000, team: "third engineer; motorman", elapsed: 12, cautions: ["isolation"], measurements: "Piston clearance [mm] ..0.4" });
  r({ component: `AIR.R${i}`, word: "INSPECT", title: `Starting air receiver internal inspection, receiver ${i}`, every: "every 2 years", team: "second engineer; motorman", elapsed: 6, port: true, critical: true, classRelated: true, classItem: `AR-${i}`, cautions: ["enclosed-space", "starting-air"] });
  r({ component: `AIR.R${i}`, word: "SAFETYVALVE", title: `Receiver safety valve test, receiver ${i}`, every: "every year", team: "second engineer", elapsed: 1, critical: true, classRelated: true });
  r({ component: `AIR.R${i}`, word: "DRAIN", title: `Receiver drain check, receiver ${i}`, every: "every week", team: "motorman", elapsed: 0.5 });
}
r({ component: "AIR.SVC", word: "SERVICE", title: "Service air compressor and dryer service", every: "every 6 months", team: "fourth engineer", elapsed: 3 });

for (const [c, n] of [["SEP.FO1", "fuel oil purifier 1"], ["SEP.FO2", "fuel oil purifier 2"], ["SEP.LO", "lube oil purifier"]] as const) {
  const byHours = c !== "SEP.FO2";
  r({ component: c, word: "BOWL", title: `Bowl cleaning and inspection, ${n}`, ...(byHours ? { hours: 1000 } : { every: "every 2 months" }), team: "fourth engineer; motorman", elapsed: 3, parts: "Bowl O-ring kit", cautions: ["isolation", "hot-work"] });
  r({ component: c, word: "MAJOR", title: `Major service, ${n}`, ...(byHours ? { hours: 8000 } : { every: "every year" }), team: "third engineer; motorman", elapsed: 8, parts: "Major service kit", cautions: ["isolation"] });
  r({ component: c, word: "GEAR", title: `Gear oil change, ${n}`, ...(byHours ? { hours: 2000 } : { every: "every 4 months" }), team: "motorman", elapsed: 1 });
}

for (const [code, name, critical] of pumps) {
  for (const n of [1, 2]) {
    const c = `PMP.${code}${n}`;
    r({ component: c, word: "INSPECT", title: `${name} ${n}: running check, bearings and seal`, every: "every 3 months", team: "motorman", elapsed: 1, critical: critical || undefined, checklist: ["Listen, feel for vibration", "Check the seal for leakage", "Check motor current"] });
    r({ component: c, word: "OVERHAUL", title: `${name} ${n}: overhaul`, every: critical ? "every 2 years" : "every 3 years", team: "third engineer; motorman", elapsed: 6, critical: critical || undefined, parts: "Mechanical seal; bearings; wear rings", cautions: ["isolation"], measurements: "Wear ring clearance [mm] ..0.8" });
    if (critical) r({ component: c, word: "ALIGN", title: `${name} ${n}: coupling and alignment check`, every: "every 2 years", team: "third engineer; motorman", elapsed: 3, measurements: "Offset [mm] ..0.10", cautions: ["isolation"] });
    r({ component: c, word: "INSULATION", title: `${name} ${n}: motor insulation test`, every: "every year", team: "electro-technical officer", elapsed: 1, cautions: ["isolation"], measurements: "Insulation resistance [MΩ] 1.." });
  }
}
r({ component: "PMP.FIRE", word: "TEST", title: "Main fire pump operation test", every: "monthly", team: "third engineer", elapsed: 1, critical: true, classRelated: true, measurements: "Pressure at hydrant [bar] 2.7.." });
r({ component: "PMP.FIRE", word: "OVERHAUL", title: "Main fire pump overhaul", every: "every 2 years", team: "third engineer; motorman", elapsed: 6, critical: true, cautions: ["isolation"] });
r({ component: "PMP.EFP", word: "TEST", title: "Emergency fire pump test", every: "every week on Monday", team: "third engineer", elapsed: 0.5, critical: true, classRelated: true, classItem: "FF-EP" });
r({ component: "PMP.EFP", word: "SERVICE", title: "Emergency fire pump engine service", hours: 250, team: "fourth engineer", elapsed: 2, critical: true });

for (const [code, name] of [["CFW1", "Central cooler 1"], ["CFW2", "Central cooler 2"], ["LOC", "Main lube oil cooler"], ["JCWC", "Jacket water cooler"], ["FOH", "Fuel oil heater"]] as const) {
  r({ component: `HX.${code}`, word: "CLEAN", title: `${name}: open and clean`, every: code.startsWith("CFW") ? "every year" : "every 2 years", team: "third engineer; motorman x2", elapsed: 8, port: true, cautions: ["isolation"], parts: "Plate gaskets" });
  r({ component: `HX.${code}`, word: "DP", title: `${name}: pressure drop record`, every: "every month", team: "fourth engineer", elapsed: 0.5, measurements: "Pressure drop [bar] ..0.8" });
}

r({ component: "BLR", word: "WATER", title: "Boiler water test and treatment", every: "daily", team: "fourth engineer", elapsed: 0.5, measurements: "Chloride [ppm] ..50 | Alkalinity [ppm] 100..300" });
r({ component: "BLR", word: "INSPECT", title: "Boiler internal inspection", every: "every 2 years", anniversary: "next", team: "second engineer; motorman x2", elapsed: 16, port: true, critical: true, classRelated: true, classItem: "BLR-1", cautions: ["enclosed-space", "isolation", "permit-to-work"] });
r({ component: "BLR", word: "GAUGEGLASS", title: "Gauge glass blow-down and check", every: "every week", team: "fourth engineer", elapsed: 0.5 });
r({ component: "BLR.BRN", word: "NOZZLE", title: "Burner nozzle clean and flame safeguard check", hours: 500, team: "fourth engineer", elapsed: 2, cautions: ["isolation", "hot-work"] });
r({ component: "BLR.BRN", word: "SERVICE", title: "Burner service and combustion check", hours: 4000, team: "third engineer; electro-technical officer", elapsed: 6 });
r({ component: "BLR.SV", word: "TEST", title: "Boiler safety valve lifting test", every: "every year", team: "chief engineer; second engineer", elapsed: 3, critical: true, classRelated: true, classItem: "BLR-SV", port: true });
r({ component: "BLR.FWP", word: "CHECK", title: "Feed water pumps running check", every: "every 3 months", team: "motorman", elapsed: 1 });
r({ component: "BLR.EGE", word: "WASH", title: "Exhaust gas economiser water wash", every: "every 3 months", team: "third engineer; motorman x2", elapsed: 6, port: true, cautions: ["hot-work", "permit-to-work"] });

r({ component: "SG", word: "PREDEPARTURE", title: "Steering gear test before departure", portEvent: "departure", portEventHours: 12, team: "second engineer; electro-technical officer", elapsed: 1, critical: true, classRelated: true, checklist: ["Full movement on each pump and each power unit", "Rudder angle indicators agree", "Alarms and communication to the bridge", "Enter in the log"] });
r({ component: "SG", word: "EMERGENCY", title: "Emergency steering drill", every: "every 3 months", team: "chief engineer; second engineer; motorman", elapsed: 1, critical: true, classRelated: true });
r({ component: "SG", word: "OILSAMPLE", title: "Steering gear hydraulic oil sample", every: "every 6 months", team: "fourth engineer", elapsed: 0.5 });
for (const n of [1, 2]) r({ component: `SG.P${n}`, word: "INSPECT", title: `Steering gear pump ${n}: check and filter`, every: "every 3 months", team: "third engineer", elapsed: 2, critical: true, cautions: ["isolation"] });
r({ component: "SG.RAM", word: "GREASE", title: "Rudder carrier and ram greasing", every: "every week", team: "motorman", elapsed: 0.5 });
r({ component: "SG.RAM", word: "WEARDOWN", title: "Rudder wear-down measurement", every: "every year", team: "second engineer", elapsed: 2, port: true, measurements: "Wear-down [mm] ..3.0", classRelated: true });

r({ component: "ENV.OWS", word: "TEST", title: "Oily water separator and 15 ppm alarm function test", every: "every month", team: "third engineer", elapsed: 1, critical: true, classRelated: true, classItem: "MP-OWS" });
r({ component: "ENV.OWS", word: "CALIB", title: "15 ppm monitor calibration check", every: "every year", team: "electro-technical officer", elapsed: 2, port: true, critical: true, classRelated: true });
r({ component: "ENV.OWS", word: "CLEAN", title: "Oily water separator cleaning", every: "every 6 months", team: "fourth engineer; motorman", elapsed: 6, cautions: ["isolation"] });
r({ component: "ENV.STP", word: "SERVICE", title: "Sewage plant blowers and chlorination service", every: "every 3 months", team: "fourth engineer", elapsed: 3, cautions: ["enclosed-space"] });
r({ component: "ENV.INC", word: "CLEAN", title: "Incinerator cleaning and burner check", every: "every 2 months", team: "fourth engineer; motorman", elapsed: 3, cautions: ["hot-work", "isolation"] });
r({ component: "ENV.FWG", word: "CLEAN", title: "Fresh water generator plates cleaning", every: "every 6 months", team: "third engineer; motorman", elapsed: 6, cautions: ["isolation"] });
r({ component: "ENV.FWG", word: "SALINITY", title: "Salinometer check", every: "every month", team: "electro-technical officer", elapsed: 0.5, measurements: "Salinity [ppm] ..10" });

r({ component: "EL.MSB", word: "THERMO", title: "Main switchboard thermographic survey", every: "every year", team: "electro-technical officer", elapsed: 4, critical: true, port: true });
r({ component: "EL.MSB", word: "BREAKERS", title: "Generator breaker and protection test", every: "every 2 years", team: "electro-technical officer; second engineer", elapsed: 8, port: true, critical: true, classRelated: true, classItem: "EL-MSB", cautions: ["isolation", "permit-to-work"] });
r({ component: "EL.MSB", word: "EARTH", title: "Earth fault monitor check", every: "every week", team: "electro-technical officer", elapsed: 0.5 });
r({ component: "EL.MSB", word: "PREFERENTIAL", title: "Preferential trip test", every: "every 6 months", team: "electro-technical officer", elapsed: 2, port: true, critical: true });
r({ component: "EL.ESB", word: "TEST", title: "Emergency switchboard and emergency lighting test", every: "every month", team: "electro-technical officer", elapsed: 2, critical: true, classRelated: true });
r({ component: "EL.UPS", word: "CHECK", title: "UPS and 24 V battery capacity check", every: "every 3 months", team: "electro-technical officer", elapsed: 2, critical: true });
r({ component: "EL.SHORE", word: "CHECK", title: "Shore connection box inspection", every: "every year", team: "electro-technical officer", elapsed: 1, cautions: ["isolation"] });
for (const n of [1, 2]) r({ component: `EL.TR${n}`, word: "INSPECT", title: `Transformer ${n} inspection and cleaning`, every: "every 2 years", team: "electro-technical officer", elapsed: 2, port: true, cautions: ["isolation", "permit-to-work"] });

r({ component: "SAFE.LB", word: "RUN", title: "Lifeboat engine weekly run", rrule: "FREQ=WEEKLY;BYDAY=FR", team: "fourth engineer", elapsed: 0.5, critical: true, classRelated: true, classItem: "LSA-LB" });
r({ component: "SAFE.LB", word: "SERVICE", title: "Lifeboat engine service", every: "every year", team: "fourth engineer", elapsed: 3, critical: true });
r({ component: "SAFE.DAV", word: "INSPECT", title: "Davit and winch inspection", every: "every month", team: "second engineer; motorman", elapsed: 1, critical: true, classRelated: true });
r({ component: "SAFE.DAV", word: "THOROUGH", title: "Davit and on-load release gear thorough examination", every: "every year", anniversary: "next", team: "chief engineer; second engineer", elapsed: 4, port: true, critical: true, classRelated: true, classItem: "LSA-DAV" });
r({ component: "SAFE.CO2", word: "CHECK", title: "CO2 system visual check and cylinder weights", rrule: "FREQ=MONTHLY;BYMONTHDAY=1", team: "second engineer", elapsed: 1, critical: true, classRelated: true, classItem: "FF-CO2", cautions: ["enclosed-space"] });
r({ component: "SAFE.CO2", word: "SERVICE", title: "CO2 system service by the shore firm", every: "every 2 years", team: "second engineer", elapsed: 6, port: true, critical: true, classRelated: true });
r({ component: "SAFE.QCV", word: "TEST", title: "Quick-closing valves remote operation test", every: "every 3 months", team: "third engineer; motorman", elapsed: 2, critical: true, classRelated: true });
r({ component: "SAFE.FD", word: "TEST", title: "Fire detection loop and detector test", every: "every 3 months", team: "electro-technical officer", elapsed: 4, critical: true, classRelated: true, classItem: "FF-FD" });

for (const [code, name] of [["WIN1", "Windlass forward"], ["MOOR1", "Mooring winch 1"], ["MOOR2", "Mooring winch 2"], ["CRANE", "Provision crane"], ["HPU", "Hatch cover hydraulic unit"]] as const) {
  r({ component: `DECK.${code}`, word: "GREASE", title: `${name}: greasing and brake check`, every: "every month", team: "motorman", elapsed: 1 });
  r({ component: `DECK.${code}`, word: "OIL", title: `${name}: hydraulic or gear oil sample`, every: "every 6 months", team: "fourth engineer", elapsed: 0.5 });
  r({ component: `DECK.${code}`, word: "OVERHAUL", title: `${name}: overhaul and load test`, every: "every 5 years", team: "second engineer; motorman x2", elapsed: 12, port: true, cautions: ["isolation"] });
}
for (const [code, name] of [["ERF1", "Engine room supply fan 1"], ["ERF2", "Engine room supply fan 2"], ["AC", "Accommodation air conditioning"], ["PROV", "Provision refrigeration plant"]] as const) {
  r({ component: `HVAC.${code}`, word: "CHECK", title: `${name}: running check and filters`, every: "every month", team: "motorman", elapsed: 1 });
  r({ component: `HVAC.${code}`, word: "SERVICE", title: `${name}: service`, every: "every year", team: "electro-technical officer; motorman", elapsed: 4, cautions: ["isolation"] });
}

// ── Rows, and the last-done day each routine counts from ───────────────────────────────────────
/** How far through its interval a routine is: mostly ahead, some in the window, a few late (as db/seed/plan.ts). */
function progress(): number {
  const x = random();
  if (x < 0.78) return 0.05 + random() * 0.8;
  if (x < 0.91) return 0.91 + random() * 0.08;
  if (x < 0.97) return 1.005 + random() * 0.03;
  return 1.06 + random() * 0.06;
}
const DAYS_OF: Record<string, number> = { day: 1, week: 7, month: 30.44, year: 365.25 };
function calendarDays(x: Routine): number {
  if (x.rrule) return x.rrule.startsWith("FREQ=WEEKLY") ? 7 : 30.44;
  const m = /^every(?: (\d+))? (day|week|month|year)s?/.exec(x.every ?? "");
  if (m) return Number(m[1] ?? 1) * DAYS_OF[m[2]!]!;
  return { daily: 1, weekly: 7, monthly: 30.44 }[x.every ?? ""] ?? 30.44;
}
const lastDay = parseISO(WRITTEN_ON);
const seen = new Set<string>();
for (const x of routines) {
  const code = `${x.component}/${x.word}`;
  if (seen.has(code)) throw new Error(`two routines ${code}`);
  seen.add(code);
  rows.routines.push({
    code,
    component: x.component,
    title: x.title,
    every_hours: x.hours ? String(x.hours) : "",
    every: x.every ?? "",
    rrule: x.rrule ?? "",
    // The next anniversary, as far ahead as the routine is from its last one.
    anniversary: x.anniversary ? format(addDays(lastDay, Math.round((1 - progress()) * calendarDays(x))), "yyyy-MM-dd") : "",
    tolerance_rule: "",
    team: x.team,
    elapsed_hours: String(x.elapsed),
    engine_stop: x.engineStop ? "yes" : "no",
    needs_port: x.port ? "yes" : "no",
    port_event: x.portEvent ?? "",
    port_event_hours: x.portEventHours ? String(x.portEventHours) : "",
    critical: x.critical ? "yes" : "no",
    class_related: x.classRelated ? "yes" : "no",
    class_item: x.classItem ?? "",
    checklist: (x.checklist ?? (x.cautions?.includes("isolation") ? LOCKOUT : [])).join(" | "),
    measurements: x.measurements ?? "",
    spare_parts: x.parts ?? "",
    cautions: (x.cautions ?? []).join("; "),
    description: x.cautions?.length ? "Follow the maker's manual and the company's permit-to-work procedure." : "",
  });
  const f = progress();
  if (x.hours) {
    const totals = series.get(counterOf.get(x.component)!)!;
    const now = totals.at(-1)!;
    const target = Math.max(0, now - f * x.hours);
    // The last day the counter was at or below the target, or before the readings at its average rate.
    let day = totals.findLastIndex((t) => t <= target);
    let hours = day >= 0 ? totals[day]! : target;
    if (day < 0) {
      const rate = Math.max(0.1, (now - totals[0]!) / DAYS);
      day = -Math.ceil((totals[0]! - target) / rate);
      hours = Math.round(target * 10) / 10;
    }
    rows["last-done"].push({ routine: code, done_on: format(addDays(lastDay, day - DAYS), "yyyy-MM-dd"), counter_hours: hours.toFixed(1), remarks: "From the previous system" });
  } else if (!x.portEvent) {
    const ago = Math.max(1, Math.round(f * calendarDays(x)));
    rows["last-done"].push({ routine: code, done_on: format(addDays(lastDay, -ago), "yyyy-MM-dd"), counter_hours: "", remarks: "From the previous system" });
  }
}

mkdirSync(OUT, { recursive: true });
for (const kind of Object.keys(rows) as ImportKind[]) {
  const fields = LAYOUT[kind].columns.map((c) => c.name);
  const used = fields.filter((f) => rows[kind].some((row) => row[f] !== undefined));
  writeFileSync(path.join(OUT, `${kind}.csv`), `${Papa.unparse({ fields: used, data: rows[kind].map((row) => used.map((f) => row[f] ?? "")) }, { newline: "\n" })}\n`);
}
writeFileSync(path.join(OUT, "written-on.txt"), `${WRITTEN_ON}\n`);
console.log(Object.entries(rows).map(([k, v]) => `${k}: ${v.length}`).join(", "));
