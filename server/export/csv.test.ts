// The CSV writer against RFC 4180 (Common Format and MIME Type for CSV Files, section 2 — not in
// ../shared/SOURCES.md; the rules are quoted from memory): fields with commas, quotes or line breaks
// are enclosed in double quotes, a quote inside is doubled, records end in CRLF. Formula escaping is
// common practice (the OWASP "CSV Injection" advice, from memory): a cell starting with =, +, -, @
// gets a leading apostrophe.
import { describe, expect, it } from "vitest";
import { csvResponse, toCsv } from "./csv";

type Row = { title: string; hours: number | null; critical: boolean };
const columns = [
  { header: "Title", value: (r: Row) => r.title },
  { header: "Hours", value: (r: Row) => r.hours },
  { header: "Critical", value: (r: Row) => r.critical },
];

describe("toCsv", () => {
  it("quotes commas, quotes and line breaks as RFC 4180 section 2 says, with CRLF between records", () => {
    const csv = toCsv(columns, [
      { title: 'Overhaul "A", unit 2', hours: 12.5, critical: true },
      { title: "Check\nlube oil", hours: null, critical: false },
    ]);
    expect(csv).toBe('Title,Hours,Critical\r\n"Overhaul ""A"", unit 2",12.5,yes\r\n"Check\nlube oil",,');
  });

  it("escapes a cell that a spreadsheet would run as a formula", () => {
    const csv = toCsv(columns, [{ title: "=HYPERLINK(\"x\")", hours: 1, critical: false }]);
    expect(csv.split("\r\n")[1]).toBe(`"'=HYPERLINK(""x"")",1,`);
  });
});

describe("csvResponse", () => {
  it("is a UTF-8 attachment with a byte order mark and a safe file name", async () => {
    const res = csvResponse("A\r\nÅlesund", "AG backlog 2026/12/01.csv");
    expect(res.headers.get("content-type")).toBe("text/csv; charset=utf-8");
    expect(res.headers.get("content-disposition")).toBe('attachment; filename="AG-backlog-2026-12-01.csv"');
    const bytes = new Uint8Array(await res.arrayBuffer());
    expect([...bytes.slice(0, 3)]).toEqual([0xef, 0xbb, 0xbf]);
  });
});
