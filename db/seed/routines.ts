// The demo maintenance plan: routines per component code. Intervals are editable demo defaults —
// marine-diesel figures are `common practice` and vary by maker (SOURCES.md, "Running-hour facts");
// the SOLAS and MSC figures are named where they apply. None of this replaces the maker's manual.
import type { Rank } from "../../server/routines/contract";
import type { RoutineCaution, RoutineMeasurement } from "../schema/maintenance";

export type DemoRoutine = {
  component: string;
  title: string;
  intervalHours?: number;
  /** RFC 5545 RRULE without DTSTART. */
  calendarRule?: string;
  anchored?: boolean;
  /** One person's man-hours when no team is given; with a team, derived (elapsed × people). */
  manHours: number;
  rank: Rank;
  /** Who does it and for how long (`common practice` demo values, not a maker's figures). */
  team?: { rank: Rank; count: number }[];
  elapsedHours?: number;
  needsPort?: boolean;
  /** Falls due at every stay's departure or arrival instead of an interval. */
  portEvent?: { event: "departure" | "arrival"; withinHours: number };
  engineStop?: boolean;
  critical?: boolean;
  classRelated?: boolean;
  checklist: string[];
  measurements?: RoutineMeasurement[];
  spareParts?: string;
  cautions?: RoutineCaution[];
};

const overhaulSteps = [
  "Stop, isolate and lock out; post the permit to work",
  "Open up and clean",
  "Inspect and measure against the maker's limits",
  "Renew worn and single-use parts",
  "Reassemble to the maker's clearances and torques",
  "Test run and check for leaks",
];

export const cylinderRoutines = (n: number): DemoRoutine[] => [
  {
    component: `ME.CYL.${n}`,
    title: `Cylinder unit ${n}: piston overhaul and liner gauging`,
    intervalHours: 16_000,
    manHours: 36,
    rank: "second-engineer",
    team: [
      { rank: "second-engineer", count: 1 },
      { rank: "motorman", count: 2 },
    ],
    elapsedHours: 12,
    engineStop: true,
    critical: true,
    classRelated: true,
    checklist: overhaulSteps,
    measurements: [
      { name: "Liner wear, top ring TDC", unit: "mm", lower: 0, upper: 0.8 },
      { name: "Ring groove clearance", unit: "mm", lower: 0.2, upper: 0.5 },
    ],
    spareParts: "Piston ring set, O-rings for the liner, stuffing box rings",
    cautions: ["isolation", "permit-to-work", "turning-gear", "starting-air", "enclosed-space"],
  },
  {
    component: `ME.CYL.${n}`,
    title: `Cylinder unit ${n}: exhaust valve overhaul`,
    intervalHours: 8_000,
    manHours: 12,
    rank: "third-engineer",
    team: [
      { rank: "third-engineer", count: 1 },
      { rank: "motorman", count: 1 },
    ],
    elapsedHours: 6,
    engineStop: true,
    critical: true,
    checklist: overhaulSteps,
    measurements: [{ name: "Spindle seat width", unit: "mm", lower: 2, upper: 4 }],
    spareParts: "Spindle seat ring, O-rings, valve housing gasket",
    cautions: ["isolation", "permit-to-work", "turning-gear"],
  },
];

export const generatorRoutines = (n: number): DemoRoutine[] => [
  {
    component: `AE.${n}`,
    title: `Generator set ${n}: lube oil and filter change`,
    intervalHours: 1_000,
    manHours: 3,
    rank: "fourth-engineer",
    checklist: ["Take an oil sample", "Drain sump", "Renew filter cartridges", "Refill and run up", "Check for leaks"],
    spareParts: "Lube oil filter cartridges",
    cautions: ["isolation", "hot-work"],
  },
  {
    component: `AE.${n}.FIV`,
    title: `Generator set ${n}: fuel injector pressure test`,
    intervalHours: 2_000,
    manHours: 4,
    rank: "third-engineer",
    checklist: [
      "Remove injectors",
      "Pressure test on the test bench",
      "Renew nozzles out of limits",
      "Refit to torque",
    ],
    measurements: [{ name: "Opening pressure", unit: "bar", lower: 380, upper: 400 }],
    spareParts: "Nozzle tips, copper sealing rings",
    cautions: ["isolation"],
  },
  {
    component: `AE.${n}`,
    title: `Generator set ${n}: cylinder heads and valves`,
    intervalHours: 12_000,
    manHours: 30,
    rank: "second-engineer",
    team: [
      { rank: "second-engineer", count: 1 },
      { rank: "oiler", count: 1 },
    ],
    elapsedHours: 15,
    critical: true,
    classRelated: true,
    checklist: overhaulSteps,
    measurements: [{ name: "Valve clearance, inlet", unit: "mm", lower: 0.4, upper: 0.5 }],
    spareParts: "Valve seat rings, head gaskets",
    cautions: ["isolation", "permit-to-work", "turning-gear"],
  },
  {
    component: `AE.${n}.TC`,
    title: `Turbocharger ${n}: compressor wash`,
    intervalHours: 100,
    manHours: 0.5,
    rank: "motorman",
    checklist: [
      "Run at the maker's load for washing",
      "Inject the wash water",
      "Record exhaust temperatures before and after",
    ],
    cautions: [],
  },
];

const compressorValves = (n: number): DemoRoutine => ({
  component: `AC.${n}`,
  title: `Main air compressor ${n}: valves overhaul`,
  intervalHours: 2_000,
  manHours: 5,
  rank: "third-engineer",
  critical: true,
  checklist: ["Isolate and vent", "Renew suction and delivery valves", "Test run and check the safety valve"],
  spareParts: "Valve kit, gaskets",
  cautions: ["isolation", "starting-air"],
});

export const vesselRoutines: DemoRoutine[] = [
  {
    component: "ME",
    title: "Main engine: crankcase inspection and deflection readings",
    intervalHours: 4_000,
    manHours: 8,
    rank: "second-engineer",
    team: [
      { rank: "second-engineer", count: 1 },
      { rank: "motorman", count: 1 },
    ],
    elapsedHours: 4,
    engineStop: true,
    critical: true,
    classRelated: true,
    checklist: [
      "Engage turning gear, close starting air",
      "Ventilate the crankcase before entry",
      "Inspect bearings and running gear",
      "Take crankshaft deflections",
      "Close up",
    ],
    measurements: [{ name: "Deflection, unit 1", unit: "1/100 mm", lower: -10, upper: 10 }],
    cautions: ["isolation", "enclosed-space", "turning-gear", "starting-air", "permit-to-work"],
  },
  {
    component: "ME.TC",
    title: "Main engine turbocharger: overhaul",
    intervalHours: 24_000,
    manHours: 24,
    rank: "chief-engineer",
    // The maker's service engineer attends in port.
    team: [
      { rank: "chief-engineer", count: 1 },
      { rank: "second-engineer", count: 1 },
      { rank: "motorman", count: 1 },
    ],
    elapsedHours: 8,
    needsPort: true,
    engineStop: true,
    critical: true,
    classRelated: true,
    checklist: overhaulSteps,
    spareParts: "Bearing set, labyrinth seals",
    cautions: ["isolation", "permit-to-work", "hot-work"],
  },
  {
    component: "ME.FIV",
    title: "Main engine: fuel valves pressure test",
    intervalHours: 3_000,
    manHours: 10,
    rank: "third-engineer",
    team: [
      { rank: "third-engineer", count: 1 },
      { rank: "motorman", count: 1 },
    ],
    elapsedHours: 5,
    engineStop: true,
    checklist: ["Remove fuel valves", "Test opening pressure", "Recondition or renew nozzles", "Refit"],
    measurements: [{ name: "Opening pressure", unit: "bar", lower: 320, upper: 350 }],
    cautions: ["isolation"],
  },
  {
    component: "ME.GOV",
    title: "Governor: oil change and function test",
    calendarRule: "FREQ=MONTHLY;INTERVAL=6",
    manHours: 2,
    rank: "second-engineer",
    engineStop: true,
    critical: true,
    checklist: ["Change governor oil", "Check linkage for free movement", "Function test on starting"],
    cautions: ["isolation"],
  },
  {
    component: "EG",
    title: "Emergency generator: weekly test run on load",
    calendarRule: "FREQ=WEEKLY;BYDAY=SA",
    manHours: 0.5,
    rank: "electro-technical-officer",
    critical: true,
    // common practice and flag guidance; SOLAS II-1/43.7 requires periodic testing, no interval.
    checklist: [
      "Check fuel, oil and coolant",
      "Start on both starting systems",
      "Run on load 15 minutes",
      "Record in the log",
    ],
    cautions: [],
  },
  {
    component: "EG",
    title: "Emergency generator: annual survey with class",
    calendarRule: "FREQ=YEARLY",
    anchored: true,
    manHours: 4,
    rank: "chief-engineer",
    // The class surveyor attends in port.
    team: [
      { rank: "chief-engineer", count: 1 },
      { rank: "electro-technical-officer", count: 1 },
    ],
    elapsedHours: 2,
    needsPort: true,
    critical: true,
    classRelated: true,
    checklist: [
      "Prepare the generator and switchboard",
      "Demonstrate automatic start and connection",
      "Record findings",
    ],
    cautions: ["isolation"],
  },
  ...[1, 2].map(compressorValves),
  {
    component: "AC.RCV",
    title: "Starting air receivers: internal inspection",
    calendarRule: "FREQ=YEARLY;INTERVAL=2",
    anchored: true,
    manHours: 6,
    rank: "second-engineer",
    classRelated: true,
    checklist: ["Isolate, vent and open", "Ventilate before entry", "Inspect internally", "Test safety valves"],
    cautions: ["isolation", "enclosed-space", "permit-to-work", "starting-air"],
  },
  {
    component: "PU.FO.1",
    title: "Fuel oil purifier: bowl cleaning and inspection",
    intervalHours: 1_500,
    manHours: 4,
    rank: "fourth-engineer",
    checklist: ["Stop and isolate", "Dismantle the bowl", "Clean discs", "Inspect seals", "Reassemble and test"],
    spareParts: "Bowl seal kit",
    cautions: ["isolation", "hot-work"],
  },
  {
    component: "PU.LO.1",
    title: "Lube oil purifier: bowl cleaning and inspection",
    intervalHours: 2_000,
    manHours: 4,
    rank: "fourth-engineer",
    checklist: ["Stop and isolate", "Dismantle the bowl", "Clean discs", "Reassemble and test"],
    cautions: ["isolation"],
  },
  {
    component: "BL",
    // SOURCES.md, boilers: at least two internal examinations in each 5-year cycle, ≤ 36 months apart.
    title: "Auxiliary boiler: internal examination with class",
    calendarRule: "FREQ=MONTHLY;INTERVAL=30",
    anchored: true,
    manHours: 16,
    rank: "chief-engineer",
    team: [
      { rank: "chief-engineer", count: 1 },
      { rank: "fourth-engineer", count: 1 },
    ],
    elapsedHours: 8,
    needsPort: true,
    critical: true,
    classRelated: true,
    checklist: [
      "Shut down and cool",
      "Drain, open and ventilate",
      "Internal examination with the surveyor",
      "Close up and hydrostatic test",
    ],
    cautions: ["isolation", "enclosed-space", "permit-to-work", "hot-work"],
  },
  {
    component: "BL.BRN",
    title: "Boiler burner: clean nozzle and check flame safeguard",
    calendarRule: "FREQ=MONTHLY",
    manHours: 1.5,
    rank: "fourth-engineer",
    checklist: ["Clean nozzle and electrodes", "Test the flame failure trip"],
    cautions: ["isolation", "hot-work"],
  },
  {
    component: "SG.P1",
    // SOLAS V/26: checked and tested within 12 hours before departure (memory, SOURCES.md).
    title: "Steering gear: test before departure",
    portEvent: { event: "departure", withinHours: 12 },
    manHours: 0.5,
    rank: "second-engineer",
    critical: true,
    checklist: ["Full movement hard over to hard over", "Check both pumps", "Test alarms", "Record in the log"],
    cautions: [],
  },
  {
    component: "LSA.LB",
    // SOLAS III/20.6: lifeboat engines run weekly for not less than 3 minutes.
    title: "Lifeboat engine: weekly run (at least 3 minutes)",
    calendarRule: "FREQ=WEEKLY;BYDAY=TH",
    manHours: 0.5,
    rank: "fourth-engineer",
    critical: true,
    checklist: ["Check fuel", "Start and run ahead and astern, at least 3 minutes", "Record in the log"],
    cautions: [],
  },
  {
    component: "FF.EFP",
    // MSC.1/Circ.1432: fire pumps operated monthly; flow test annually.
    title: "Emergency fire pump: monthly operation",
    calendarRule: "FREQ=MONTHLY",
    manHours: 0.5,
    rank: "third-engineer",
    critical: true,
    checklist: ["Start from the local and remote positions", "Check delivery pressure", "Record in the log"],
    measurements: [{ name: "Delivery pressure", unit: "bar", lower: 2.7, upper: null }],
    cautions: [],
  },
  {
    component: "FF.EFP",
    title: "Emergency fire pump: annual flow test",
    calendarRule: "FREQ=YEARLY",
    anchored: true,
    manHours: 2,
    rank: "second-engineer",
    critical: true,
    classRelated: true,
    checklist: ["Rig hoses to the two highest outlets", "Run and measure jet and pressure", "Record findings"],
    cautions: [],
  },
];

export function routinesFor(cylinders: number, generators: number): DemoRoutine[] {
  return [
    ...vesselRoutines,
    ...Array.from({ length: cylinders }, (_, i) => cylinderRoutines(i + 1)).flat(),
    ...Array.from({ length: generators }, (_, i) => generatorRoutines(i + 1)).flat(),
  ];
}
