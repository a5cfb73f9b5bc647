// The import's readers and row checks with hand-made files: every kind of bad row gets its message
// with its file, row and column; CSV with commas or semicolons, with or without a byte-order mark;
// another encoding refused; a workbook's date and number cells read as a person sees them.
import ExcelJS from "exceljs";
import { describe, expect, it } from "vitest";
import { checkImport, type VesselNow } from "./check-rows";
import { problemLine } from "./problems";
import { MAX_IMPORT_BYTES, readImportFiles } from "./read-file";
import { readRuleWords } from "./rule-words";

const utf8 = (text: string) => new TextEncoder().encode(text);
const file = (name: string, text: string) => ({ name, bytes: utf8(text) });
const empty = (): VesselNow => ({
  components: new Map(),
  counters: new Map(),
  routines: new Map(),
  toleranceRules: new Map([["annual: 3 months either side of the anniversary", "rule-1"]]),
  rankNames: {},
  timeZone: "Asia/Singapore",
  clock: new Date("2026-12-01T00:00:00Z"),
  readings: new Map(),
});

const COUNTERS = "counter,planned_hours_per_day\nMain engine,18\nGenerator 1,12\n";
const COMPONENTS = [
  "code,name,parent,critical,class_item,counter,maker,model",
  "ME,Main engine,,yes,ME-1,Main engine,,",
  "ME.CYL.3,Cylinder unit 3,ME,yes,,,,",
  "AE.1,Generator set 1,,no,,Generator 1,,",
].join("\n");
const ROUTINES = [
  "code,component,title,every_hours,every,rrule,anniversary,tolerance_rule,team,elapsed_hours,engine_stop,critical,checklist,measurements,cautions",
  'ME.CYL.3/OVH,ME.CYL.3,Piston overhaul,16000,,,,,"second engineer; motorman x2",12,yes,yes,Isolate | Open doors,Liner wear [mm] 0..1.6,isolation; turning-gear',
  "AE.1/OIL,AE.1,Lube oil change,1000,,,,,fourth engineer,3,no,no,,,",
  "ME/CRANK,ME,Crankcase inspection,,every 6 months,,,,second engineer,2,yes,yes,,,",
].join("\n");
const LAST_DONE = "routine,done_on,counter_hours,remarks\nME.CYL.3/OVH,2025-11-20,61250,\nAE.1/OIL,2026-10-01,20100,\nME/CRANK,2026-09-01,,\n";

async function checked(files: { name: string; bytes: Uint8Array }[], now = empty()) {
  const read = await readImportFiles(files);
  const result = checkImport(read.sheets, now);
  return { ...result, lines: [...read.problems, ...result.problems].map(problemLine) };
}

describe("a good plan in four CSV files", () => {
  it("is read without a problem into counters, components and routines with their baselines", async () => {
    const r = await checked([file("counters.csv", COUNTERS), file("components.csv", COMPONENTS), file("routines.csv", ROUTINES), file("last-done.csv", LAST_DONE)]);
    expect(r.lines).toEqual([]);
    expect(r.counters.map((c) => [c.name, c.plannedHoursPerDay])).toEqual([["Main engine", 18], ["Generator 1", 12]]);
    expect(r.components.map((c) => [c.code, c.parentCode, c.critical, c.counterName])).toEqual([
      ["ME", null, true, "Main engine"],
      ["ME.CYL.3", "ME", true, null],
      ["AE.1", null, false, "Generator 1"],
    ]);
    const piston = r.routines.find((x) => x.code === "ME.CYL.3/OVH")!;
    expect(piston.routine).toMatchObject({
      intervalHours: 16000,
      team: [{ rank: "second-engineer", count: 1 }, { rank: "motorman", count: 2 }],
      elapsedHours: 12,
      estimatedManHours: 36,
      needsEngineStop: true,
      checklist: ["Isolate", "Open doors"],
      measurements: [{ name: "Liner wear", unit: "mm", lower: 0, upper: 1.6 }],
      cautions: ["isolation", "turning-gear"],
      baselineAt: "2025-11-20",
      baselineHours: 61250,
    });
    expect(r.routines.find((x) => x.code === "ME/CRANK")!.routine.calendarRule).toBe("FREQ=MONTHLY;INTERVAL=6");
  });

  it("reads the same files written by a European spreadsheet: semicolons, decimal commas and a byte-order mark", async () => {
    const semi = (text: string) => `\uFEFF${text.replaceAll(",", ";")}`;
    const counters = semi("counter,planned_hours_per_day\nMain engine,18\nGenerator 1,12\n").replace("18", "17,5");
    const r = await checked([file("counters.csv", counters), file("components.csv", semi(COMPONENTS))]);
    expect(r.lines).toEqual([]);
    expect(r.counters[0]).toMatchObject({ name: "Main engine", plannedHoursPerDay: 17.5 });
    expect(r.components).toHaveLength(3);
  });
});

describe("files Keelson cannot read", () => {
  it("refuses another encoding, an unknown file type and a file it cannot place", async () => {
    const latin1 = { name: "components.csv", bytes: Uint8Array.from([...utf8("code,name\nME,Hauptmaschine K"), 0xfc, ...utf8("hlung\n")]) };
    const r = await checked([latin1, file("plan.pdf", "%PDF"), file("notes.csv", "what,ever\n1,2\n")]);
    expect(r.lines).toEqual([
      "components.csv: The file is not UTF-8 text: in the spreadsheet program, save it as “CSV UTF-8 (comma delimited)”.",
      "plan.pdf: Keelson reads CSV files (.csv), a zip of CSV files (.zip) and Excel workbooks (.xlsx); save the file as one of those.",
      "notes.csv: Keelson cannot tell what this file holds: name it components, counters, routines, last-done or readings (e.g. routines.csv), with the header row of its layout.",
    ]);
  });

  it("refuses files over the size limit before reading them", async () => {
    const big = { name: "routines.csv", bytes: new Uint8Array(MAX_IMPORT_BYTES + 1) };
    const r = await readImportFiles([big]);
    expect(r.sheets).toEqual([]);
    expect(r.problems[0]!.message).toMatch(/^The files come to 20 MB; an import takes at most 20 MB/);
  });

  it("says which column is unknown and which required column is missing", async () => {
    const r = await checked([file("counters.csv", "counter,rate per day\nMain engine,18\n"), file("routines.csv", "code,component,title\nX,ME,Y\n")]);
    expect(r.lines).toContain("counters.csv, row 1, rate per day: Keelson's counters layout has no column “rate per day”; it is not read.");
    expect(r.lines).toContain("routines.csv, row 1, team: The routines file needs a “team” column (who does it: ranks with the number of people, separated by ;).");
  });
});

describe("bad rows, each named by file, row and column", () => {
  it("finds duplicate codes, missing parents, cycles and unknown counters in the register", async () => {
    const components = [
      "code,name,parent,critical,counter",
      "ME,Main engine,,yes,Main engine",
      "ME,Main engine again,,no,",
      "ME.CYL.9,Cylinder unit 9,ME.X,no,",
      "A,Loop A,B,no,",
      "B,Loop B,A,no,",
      "AE.1,Generator,,maybe,Generator 7",
      "bad code!,Bad,,no,",
    ].join("\n");
    const r = await checked([file("counters.csv", COUNTERS), file("components.csv", components)]);
    expect(r.lines).toEqual([
      "components.csv, row 3, code: ME is already on row 2: each component once.",
      "components.csv, row 7, critical: write yes or no, not “maybe”.",
      "components.csv, row 7, counter: “Generator 7”: no such counter in the counters file or on the vessel.",
      "components.csv, row 8, code: The code may hold only letters, digits and . _ - and must start with a letter or digit (e.g. ME.CYL.3).",
      "components.csv, row 4, parent: ME.X: no such component in this file or on the vessel.",
      "components.csv, row 5, parent: The parents go round in a circle: A → B → A.",
      "components.csv, row 6, parent: The parents go round in a circle: B → A → B.",
    ]);
  });

  it("finds a parent on the vessel, and a cycle through the vessel's tree", async () => {
    const now = empty();
    now.components.set("ME", { id: "c-me", parentCode: null });
    now.components.set("ME.TC", { id: "c-tc", parentCode: "ME.CYL.1" });
    const r = await checked([file("components.csv", "code,name,parent\nME.CYL.1,Cylinder unit 1,ME.TC\nME.CYL.2,Cylinder unit 2,ME\n")], now);
    expect(r.lines).toEqual(["components.csv, row 2, parent: The parents go round in a circle: ME.CYL.1 → ME.TC → ME.CYL.1."]);
  });

  it("finds every kind of bad routine row with a message an engineer can act on", async () => {
    const routines = [
      "code,component,title,every_hours,every,rrule,team,elapsed_hours,engine_stop,tolerance_rule,measurements,cautions,port_event",
      "R1,ME.CYL.9,Overhaul,8000,,,second engineer,4,no,,,,",
      "R2,ME,Inspection,,every 3 mnths,,second engineer,2,no,,,,",
      "R3,ME,Inspection,,every 3 months,FREQ=MONTHLY,second engineer,2,no,,,,",
      "R4,ME,Overhaul,8000,,,second engineer; cadet,4,no,,,,",
      "R5,ME,Overhaul,8000,,,second engineer,4,perhaps,,,,",
      "R6,ME,Overhaul,8000,,,second engineer,4,no,Very strict rule,,,",
      "R7,ME,Overhaul,8000,,,second engineer,4,no,,Wear [mm] a..b,,",
      "R8,ME,Overhaul,8000,,,second engineer,4,no,,,welding,",
      "R9,ME,Steering test,,,,second engineer,1,no,,,,sailing",
      "R10,ME,Overhaul,,,,second engineer,4,no,,,,",
      "R1,ME,Twice,8000,,,second engineer,4,no,,,,",
      "R11,ME,Overhaul,8000,,,second engineer,4,no,,,,",
    ].join("\n");
    const lastDone = "routine,done_on,counter_hours\nR11,20.11.2025,100\nGHOST,2026-01-01,\n";
    const r = await checked([file("components.csv", "code,name\nME,Main engine\n"), file("routines.csv", routines), file("last-done.csv", lastDone)]);
    expect(r.lines).toEqual([
      "last-done.csv, row 2, done_on: “20.11.2025” is not a day: write it as YYYY-MM-DD, e.g. 2025-11-20.",
      "routines.csv, row 2, component: ME.CYL.9: no such component in the components file or on the vessel.",
      "routines.csv, row 3, every: “every 3 mnths” is not a rule Keelson reads — try “every 3 months”.",
      "routines.csv, row 4, rrule: Give the calendar rule through the form or as an RRULE, not both.",
      expect.stringMatching(/^routines\.csv, row 5, team: “cadet” is not a rank Keelson knows: use chief engineer, /),
      "routines.csv, row 6, engine_stop: write yes or no, not “perhaps”.",
      "routines.csv, row 7, tolerance_rule: “Very strict rule” is not one of the company's tolerance rules (Company → Tolerance rules).",
      "routines.csv, row 8, measurements: “Wear [mm] a..b” is not a measurement: write name [unit] lower..upper, e.g. “Liner wear [mm] 0..1.6”.",
      "routines.csv, row 9, cautions: “welding”: cautions are isolation, permit-to-work, enclosed-space, hot-work, starting-air, turning-gear.",
      "routines.csv, row 10, port_event: write departure or arrival, not “sailing”.",
      "routines.csv, row 11, every_hours: Give the routine an interval in running hours, a calendar rule, both (whichever comes first), or tie it to every port stay.",
      "routines.csv, row 12, code: R1 is already on row 2: each routine once.",
      "routines.csv, row 13, code: R11 has no row in last-done: a routine never done needs a baseline: the counter reading it was last done at (or the reading when the count starts).",
      "routines.csv, row 13, code: R11 has no row in last-done: a routine never done needs a baseline: the ship’s day it was last done (or when the count starts).",
      "last-done.csv, row 3, routine: GHOST: no such routine in the routines file; a last-done row gives the baseline of a routine imported with it.",
    ]);
    expect(r.routines).toEqual([]);
  });
});

describe("a workbook", () => {
  it("reads one worksheet per kind, a date cell as YYYY-MM-DD and a number cell as typed", async () => {
    const book = new ExcelJS.Workbook();
    book.addWorksheet("components").addRows([["code", "name"], ["ME", "Main engine"]]);
    book.addWorksheet("counters").addRows([["counter", "planned_hours_per_day"], ["Main engine", 17.5]]);
    book.addWorksheet("last-done").addRows([["routine", "done_on", "counter_hours"], ["ME/CRANK", new Date(Date.UTC(2026, 8, 1)), 61250.5]]);
    book.addWorksheet("routines").addRows([
      ["code", "component", "title", "every", "team", "elapsed_hours", "critical"],
      ["ME/CRANK", "ME", { richText: [{ text: "Crankcase " }, { text: "inspection" }] }, "every 6 months", "second engineer", 2, true],
    ]);
    const bytes = new Uint8Array(await book.xlsx.writeBuffer());
    const r = await checked([{ name: "Aster Gale plan.xlsx", bytes }]);
    expect(r.lines).toEqual([]);
    expect(r.counters[0]!.plannedHoursPerDay).toBe(17.5);
    expect(r.routines[0]!.routine).toMatchObject({ title: "Crankcase inspection", baselineAt: "2026-09-01", calendarRule: "FREQ=MONTHLY;INTERVAL=6", critical: true });
  });

  it("refuses bytes that are not a workbook", async () => {
    const r = await readImportFiles([file("plan.xlsx", "not a zip")]);
    expect(r.problems.map(problemLine)).toEqual(["plan.xlsx: The workbook could not be opened: save it again as an Excel workbook (.xlsx)."]);
  });
});

describe("calendar rules in words", () => {
  it("reads the common ways a plan writes them", () => {
    const form = (words: string) => {
      const r = readRuleWords(words);
      return "form" in r ? r.form : r.problem;
    };
    expect(form("every 3 months")).toEqual({ every: 3, unit: "month" });
    expect(form("Every month")).toEqual({ every: 1, unit: "month" });
    expect(form("monthly")).toEqual({ every: 1, unit: "month" });
    expect(form("annually")).toEqual({ every: 1, unit: "year" });
    expect(form("every two years")).toEqual({ every: 2, unit: "year" });
    expect(form("every 2 weeks on Monday and Thursday")).toEqual({ every: 2, unit: "week", weekdays: ["MO", "TH"] });
    expect(form("weekly on saturday")).toEqual({ every: 1, unit: "week", weekdays: ["SA"] });
    expect(form("every 3 mnths")).toBe("“every 3 mnths” is not a rule Keelson reads — try “every 3 months”.");
    expect(form("3 monhts")).toBe("“3 monhts” is not a rule Keelson reads — try “every 3 months”.");
    expect(form("every month on Monday")).toBe("Weekdays go with a rule that repeats by weeks, e.g. “every 2 weeks on Monday”.");
    expect(form("when needed")).toMatch(/^“when needed” is not a rule Keelson reads: write e\.g\./);
  });
});

describe("readings history", () => {
  // Asia/Singapore is UTC+8 all year: 09:00 on the ship is 01:00 UTC.
  const READINGS_HEAD = "counter,read_at,value,meter,remark";
  const readings = (...rows: string[]) => file("readings.csv", [READINGS_HEAD, ...rows].join("\n"));

  it("reads a counter's series on the ship's clock or with an offset, and fits a replaced meter after the old one", async () => {
    const r = await checked([
      file("counters.csv", COUNTERS),
      readings(
        "Main engine,2026-11-01 09:00,61000,,",
        "Main engine,2026-11-02T01:00Z,61020.5,,after the passage",
        "Main engine,2026-11-03 09:00,61040,1,",
        "Main engine,2026-11-04 09:00,10.5,2,new meter",
        "Main engine,2026-11-05 09:00,30,2,",
      ),
    ]);
    expect(r.lines).toEqual([]);
    const [me] = r.readings;
    expect(me!.readings.map((x) => [x.readAt.toISOString(), x.meterValue, x.segment])).toEqual([
      ["2026-11-01T01:00:00.000Z", 61000, 1],
      ["2026-11-02T01:00:00.000Z", 61020.5, 1],
      ["2026-11-03T01:00:00.000Z", 61040, 1],
      ["2026-11-04T01:00:00.000Z", 10.5, 2],
      ["2026-11-05T01:00:00.000Z", 30, 2],
    ]);
    // The new meter counts from 0 h just after the old one's last reading: the total goes on from 61,040 h.
    expect(me!.segments).toEqual([{ segment: 2, startedAt: new Date("2026-11-03T01:00:01.000Z"), startMeter: 0, offsetHours: 61040 }]);
  });

  it("names each reading that breaks the Hour log's rules, and leaves the good ones", async () => {
    const r = await checked([
      file("counters.csv", COUNTERS),
      readings(
        "Main engine,2026-11-01 09:00,61000,,",
        "Main engine,2026-11-02 09:00,60990,,", // backwards
        "Main engine,2026-11-03 09:00,61060,,", // 60 h in 48 h
        "Main engine,2026-11-03 09:00,61030,,", // same instant as row 4
        "Main engine,2026-11-04 09:00,61040,,",
        "Generator 7,2026-11-04 09:00,100,,",
        "Main engine,4.11.2026,61050,,",
        "Main engine,2026-12-24 09:00,61100,,",
        "Main engine,2026-11-06 09:00,twelve,,",
        "Main engine,2026-11-07 09:00,61080,0,",
        "Main engine,2026-11-08 09:00,61090,3,",
      ),
    ]);
    expect(r.lines).toEqual([
      "readings.csv, row 7, counter: “Generator 7”: no such counter in the counters file or on the vessel.",
      "readings.csv, row 8, read_at: “4.11.2026” is not a time Keelson reads: write the ship's time as YYYY-MM-DD HH:MM (e.g. 2025-03-13 08:00), or add its UTC offset (2025-03-13T08:00+04:00).",
      "readings.csv, row 9, read_at: 24 Dec 2026 09:00 is still to come on the ship's clock.",
      "readings.csv, row 10, value: Enter the meter value in hours, with at most one decimal (e.g. 12431.5).",
      "readings.csv, row 11, meter: “0”: the meter is a whole number, 1 for the first meter fitted, 2 after one replacement…",
      "readings.csv, row 5, read_at: Main engine already has a reading at 3 Nov 2026 09:00 (row 4).",
      "readings.csv, row 3, value: Reading is lower than the previous one (61,000 h on 1 Nov 2026 09:00) — row 2.",
      "readings.csv, row 4, value: Reading advances 60 h but only 48 h passed since the previous reading (61,000 h on 1 Nov 2026 09:00) — row 2.",
      "readings.csv, row 12, meter: Meter 3 follows meter 1 (row 6): number the meters one after another.",
    ]);
    expect(r.readings[0]!.readings.map((x) => x.meterValue)).toEqual([61000, 61040]);
  });

  it("leaves alone what the vessel already has, refuses another value at the same instant, and checks against the vessel's neighbours", async () => {
    const now = empty();
    const at = (day: string) => new Date(`${day}T01:00:00Z`);
    now.counters.set("main engine", { id: "c-1", name: "Main engine" });
    now.readings.set("main engine", {
      name: "Main engine",
      currentSegment: 1,
      segments: [{ segment: 1, startedAt: at("2026-01-01"), offsetHours: 0 }],
      readings: [
        { readAt: at("2026-11-01"), meterValue: 61000, segment: 1 },
        { readAt: at("2026-11-03"), meterValue: 61040, segment: 1 },
      ],
    });
    const r = await checked(
      [
        readings(
          "Main engine,2026-11-01 09:00,61000,,",
          "Main engine,2026-11-03 09:00,61045,,",
          "Main engine,2026-11-02 09:00,61050,,", // 50 h after the vessel's reading of the day before
          "Main engine,2026-11-04 09:00,61060,,",
          "Main engine,2026-11-05 09:00,61070,2,",
        ),
      ],
      now,
    );
    expect(r.lines).toEqual([
      "readings.csv, row 3, value: Main engine already shows 61,040 h at 3 Nov 2026 09:00 on the vessel: correct it in the Hour log, not by import.",
      "readings.csv, row 6, meter: Main engine has no meter 2 (it has 1): fit a new meter in the Hour log first.",
      "readings.csv, row 4, value: Reading advances 50 h but only 24 h passed since the previous reading (61,000 h on 1 Nov 2026 09:00).",
    ]);
    expect(r.readings[0]).toMatchObject({ same: 1, readings: [{ meterValue: 61060, segment: 1 }] });
  });
});

describe("cells Keelson's own CSV export guarded against formulas", () => {
  it("come back as they were: the apostrophe before = + - @ is dropped, any other stays", async () => {
    const { toCsv } = await import("@/server/export/csv");
    const row = { counter: "=Main engine", planned_hours_per_day: "12", note: "'quoted" };
    const csv = toCsv(
      (["counter", "planned_hours_per_day"] as const).map((c) => ({ header: c, value: (r: typeof row) => r[c] })),
      [row, { ...row, counter: "-Aux", note: "" }, { ...row, counter: "'O'Brien pump" }],
    );
    expect(csv).toContain(`"'=Main engine"`);
    const r = await readImportFiles([file("counters.csv", csv)]);
    expect(r.sheets[0]!.rows.map((x) => x.values.counter)).toEqual(["=Main engine", "-Aux", "'O'Brien pump"]);
  });
});

describe("a zip of CSV files", () => {
  const zipOf = async (files: Record<string, string>, compression: "DEFLATE" | "STORE" = "DEFLATE") => {
    const JSZip = (await import("jszip")).default;
    const zip = new JSZip();
    for (const [name, text] of Object.entries(files)) zip.file(name, text);
    return { name: "alpha-plan.zip", bytes: await zip.generateAsync({ type: "uint8array", compression }) };
  };

  it("is read as its CSV files, each named inside the zip", async () => {
    const zip = await zipOf({ "plan/counters.csv": COUNTERS, "plan/components.csv": COMPONENTS, "__MACOSX/plan/._counters.csv": "junk" });
    const r = await checked([zip]);
    expect(r.lines).toEqual([]);
    expect(r.counters).toHaveLength(2);
    expect(r.components).toHaveLength(3);
    const read = await readImportFiles([zip]);
    expect(read.sheets.map((s) => s.source).sort()).toEqual(["alpha-plan.zip › components.csv", "alpha-plan.zip › counters.csv"]);
  });

  it("refuses a zip that unpacks past the limit before unpacking it, and one without CSV files", async () => {
    // A table of contents announcing one entry of 201 MB (APPNOTE.TXT 4.3.12 and 4.3.16): nothing else is read.
    const name = new TextEncoder().encode("counters.csv");
    const bytes = new Uint8Array(46 + name.length + 22);
    const view = new DataView(bytes.buffer);
    view.setUint32(0, 0x02014b50, true);
    view.setUint32(24, 201 * 1024 * 1024, true);
    view.setUint16(28, name.length, true);
    bytes.set(name, 46);
    const end = 46 + name.length;
    view.setUint32(end, 0x06054b50, true);
    view.setUint16(end + 10, 1, true);
    view.setUint32(end + 16, 0, true);
    const r = await readImportFiles([{ name: "alpha-plan.zip", bytes }]);
    expect(r.sheets).toEqual([]);
    expect(r.problems.map(problemLine)).toEqual([
      "alpha-plan.zip: The zip file unpacks to 201 MB, more than the 200 MB Keelson reads at once: split the plan into several imports.",
    ]);
    const none = await readImportFiles([await zipOf({ "readme.txt": "hello" })]);
    expect(none.problems.map(problemLine)).toEqual(["alpha-plan.zip: The zip file holds no CSV file."]);
  });
});
