// The demo scenario: an invented short-sea company, its vessels, people and machinery.
// Every name, number and figure here is made up for the demo; none is a check value.

import { DEMO_COMPANY_SLUG } from "../../server/auth/demo-company";

/** scripts/lib.sh `demo_env` gives the web the same password (KEELSON_DEMO_PASSWORD), for its sign-in page. */
export const DEMO_PASSWORD = "harbour-lights-42";

export const demoCompany = { name: "Brightwater Coastal Lines", slug: DEMO_COMPANY_SLUG };

export type DemoRole = "admin" | "superintendent" | "chief-engineer" | "engineer" | "viewer";

export const demoUsers: { name: string; email: string; role: DemoRole; rank?: string; vessels: string[] }[] = [
  { name: "Ines Varga", email: "admin@brightwater.example", role: "admin", vessels: [] },
  { name: "Tomasz Lind", email: "super@brightwater.example", role: "superintendent", vessels: [] },
  {
    name: "Rafael Okoro",
    email: "chief@brightwater.example",
    role: "chief-engineer",
    rank: "Chief engineer",
    vessels: ["AG", "CN"],
  },
  {
    name: "Mika Sandoval",
    email: "second@brightwater.example",
    role: "engineer",
    rank: "Second engineer",
    vessels: ["AG"],
  },
  {
    name: "Jonas Abara",
    email: "third@brightwater.example",
    role: "engineer",
    rank: "Third engineer",
    vessels: ["CN"],
  },
  { name: "Priya Anand", email: "viewer@brightwater.example", role: "viewer", vessels: ["AG"] },
  // Hallam Reach and Sula Meridian have their own engine officers, so every vessel gets its digests.
  {
    name: "Marisol Quintero",
    email: "chief.hallam@brightwater.example",
    role: "chief-engineer",
    rank: "Chief engineer",
    vessels: ["HR"],
  },
  {
    name: "Dario Velez",
    email: "second.hallam@brightwater.example",
    role: "engineer",
    rank: "Second engineer",
    vessels: ["HR"],
  },
  {
    name: "Aroha Tane",
    email: "chief.sula@brightwater.example",
    role: "chief-engineer",
    rank: "Chief engineer",
    vessels: ["SM"],
  },
  {
    name: "Lewis Fenner",
    email: "second.sula@brightwater.example",
    role: "engineer",
    rank: "Second engineer",
    vessels: ["SM"],
  },
];

export type DemoCounter = {
  key: string;
  name: string;
  /** Meter value a year ago. */
  start: number;
  /** How this counter's machine runs: see `dailyHours` in readings.ts. */
  duty:
    | "main"
    | "generator"
    | "emergency"
    | "compressor"
    | "purifier"
    | "continuous"
    | "boiler"
    | "steering"
    | "weekly-test"
    | "monthly-test";
  plannedHoursPerDay: number;
};

export type DemoComponent = {
  code: string;
  name: string;
  counter?: string;
  critical?: boolean;
  classItemRef?: string;
  maker?: string;
  model?: string;
};

export type DemoVessel = {
  name: string;
  code: string;
  imoNumber: string;
  timeZone: string;
  generators: number;
  /** A meter replaced this many days ago on this counter key, for the segment demo. */
  meterReplacement?: { counter: string; daysAgo: number };
  seed: number;
  /**
   * The vessel's plan comes from the spreadsheets in db/seed/onboarding/<folder>/, through Keelson's
   * own import, as a new customer's vessel would (db/seed/onboarding.ts).
   */
  onboardedFrom?: string;
};

// IMO numbers below are invented and carry a correct check digit (weights 7..2).
export const demoVessels: DemoVessel[] = [
  {
    name: "Aster Gale",
    code: "AG",
    imoNumber: "9512343",
    timeZone: "Asia/Singapore",
    generators: 3,
    meterReplacement: { counter: "AE2", daysAgo: 120 },
    seed: 11,
  },
  { name: "Corran Ness", code: "CN", imoNumber: "9633214", timeZone: "Europe/Amsterdam", generators: 4, seed: 23 },
  { name: "Hallam Reach", code: "HR", imoNumber: "9478121", timeZone: "America/Panama", generators: 3, seed: 37 },
  {
    name: "Sula Meridian",
    code: "SM",
    imoNumber: "9701451",
    timeZone: "Pacific/Auckland",
    generators: 3,
    seed: 41,
    onboardedFrom: "sula-meridian",
  },
];

export function countersFor(v: DemoVessel): DemoCounter[] {
  const generators = Array.from({ length: v.generators }, (_, i) => ({
    key: `AE${i + 1}`,
    name: `Generator engine ${i + 1}`,
    start: 21_000 + i * 7_350 + v.seed * 113,
    duty: "generator" as const,
    plannedHoursPerDay: 12,
  }));
  return [
    { key: "ME", name: "Main engine", start: 46_200 + v.seed * 311, duty: "main", plannedHoursPerDay: 18 },
    ...generators,
    { key: "EG", name: "Emergency generator", start: 640 + v.seed * 3, duty: "emergency", plannedHoursPerDay: 0.1 },
    {
      key: "AC1",
      name: "Main air compressor 1",
      start: 9_100 + v.seed * 17,
      duty: "compressor",
      plannedHoursPerDay: 2,
    },
    {
      key: "AC2",
      name: "Main air compressor 2",
      start: 8_750 + v.seed * 19,
      duty: "compressor",
      plannedHoursPerDay: 2,
    },
    { key: "PUF", name: "Fuel oil purifier 1", start: 31_400 + v.seed * 51, duty: "purifier", plannedHoursPerDay: 20 },
    { key: "PUL", name: "Lube oil purifier", start: 38_900 + v.seed * 47, duty: "continuous", plannedHoursPerDay: 23 },
    { key: "BLR", name: "Auxiliary boiler burner", start: 12_300 + v.seed * 29, duty: "boiler", plannedHoursPerDay: 6 },
    { key: "SG1", name: "Steering gear pump 1", start: 27_000 + v.seed * 31, duty: "steering", plannedHoursPerDay: 10 },
    { key: "LB", name: "Lifeboat engine", start: 118 + v.seed, duty: "weekly-test", plannedHoursPerDay: 0.1 },
    { key: "EFP", name: "Emergency fire pump", start: 204 + v.seed * 2, duty: "monthly-test", plannedHoursPerDay: 0.1 },
  ];
}

/** The machinery register, parents before children. */
export function componentsFor(v: DemoVessel): (DemoComponent & { parent?: string })[] {
  const cylinders = Array.from({ length: 6 }, (_, i) => ({
    code: `ME.CYL.${i + 1}`,
    name: `Cylinder unit ${i + 1}`,
    parent: "ME.CYL",
    classItemRef: `ME-CYL-${i + 1}`,
  }));
  const generators = Array.from({ length: v.generators }, (_, i) => [
    {
      code: `AE.${i + 1}`,
      name: `Generator set ${i + 1}`,
      parent: "AE",
      counter: `AE${i + 1}`,
      critical: true,
      classItemRef: `AE-${i + 1}`,
      maker: "Halvorsen Diesel",
      model: "H6L-23",
    },
    { code: `AE.${i + 1}.TC`, name: `Turbocharger, generator ${i + 1}`, parent: `AE.${i + 1}` },
    { code: `AE.${i + 1}.FIV`, name: `Fuel injection valves, generator ${i + 1}`, parent: `AE.${i + 1}` },
  ]).flat();
  return [
    {
      code: "ME",
      name: "Main engine",
      counter: "ME",
      critical: true,
      classItemRef: "ME",
      maker: "Nordvik Motorwerk",
      model: "6NV50-MC",
    },
    { code: "ME.TC", name: "Main engine turbocharger", parent: "ME", critical: true, classItemRef: "ME-TC" },
    { code: "ME.CYL", name: "Cylinder units", parent: "ME" },
    ...cylinders,
    { code: "ME.FIV", name: "Fuel injection valves", parent: "ME" },
    { code: "ME.GOV", name: "Governor", parent: "ME", critical: true },
    { code: "AE", name: "Generating sets" },
    ...generators,
    { code: "EG", name: "Emergency generator", counter: "EG", critical: true, classItemRef: "EG" },
    { code: "AC", name: "Starting air" },
    { code: "AC.1", name: "Main air compressor 1", parent: "AC", counter: "AC1", critical: true },
    { code: "AC.2", name: "Main air compressor 2", parent: "AC", counter: "AC2", critical: true },
    { code: "AC.RCV", name: "Starting air receivers", parent: "AC", classItemRef: "AIR-RCV" },
    { code: "PU", name: "Purifiers" },
    { code: "PU.FO.1", name: "Fuel oil purifier 1", parent: "PU", counter: "PUF" },
    { code: "PU.LO.1", name: "Lube oil purifier", parent: "PU", counter: "PUL" },
    { code: "BL", name: "Auxiliary boiler", classItemRef: "BLR-1" },
    { code: "BL.BRN", name: "Boiler burner", parent: "BL", counter: "BLR" },
    { code: "SG", name: "Steering gear", critical: true, classItemRef: "SG" },
    { code: "SG.P1", name: "Steering gear pump 1", parent: "SG", counter: "SG1", critical: true },
    { code: "LSA", name: "Life-saving appliances" },
    { code: "LSA.LB", name: "Lifeboat engine", parent: "LSA", counter: "LB", critical: true },
    { code: "FF", name: "Fire-fighting" },
    { code: "FF.EFP", name: "Emergency fire pump", parent: "FF", counter: "EFP", critical: true },
  ];
}
