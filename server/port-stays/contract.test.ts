import { describe, expect, it } from "vitest";
import { fieldErrorsFromZod } from "@/server/http/problem";
import { PackageInput, PortStayInput } from "./contract";

const stay = {
  port: "Rotterdam",
  arrivesAt: "2026-12-04T08:00",
  departsAt: "2026-12-06T17:00",
  workdayFrom: "08:00",
  workdayTo: "17:00",
  engineStop: { from: "2026-12-04T08:00", to: "2026-12-05T08:00" },
  crew: [
    { rank: "second-engineer", count: 1 },
    { rank: "motorman", count: 2 },
  ],
  watches: [{ rank: "motorman", person: 2, from: "2026-12-05T00:00", to: "2026-12-05T04:00", label: "bunkering" }],
};

function fields(input: unknown, schema: typeof PortStayInput | typeof PackageInput = PortStayInput) {
  const result = schema.safeParse(input);
  return result.success ? [] : fieldErrorsFromZod(result.error).map((e) => e.field);
}

describe("the port-stay contract", () => {
  it("takes a stay typed on the ship's clock, remarks optional", () => {
    const parsed = PortStayInput.parse(stay);
    expect(parsed.remarks).toBe("");
    expect(parsed.port).toBe("Rotterdam");
  });

  it("names the field or row of each problem", () => {
    expect(fields({ ...stay, departsAt: "2026-12-04T08:00" })).toEqual(["departsAt"]);
    // 4 Dec 08:00 + 30 days = 3 Jan 08:00: one minute more is too long.
    expect(fields({ ...stay, departsAt: "2027-01-03T08:00" })).toEqual([]);
    expect(fields({ ...stay, departsAt: "2027-01-03T08:01" })).toEqual(["departsAt"]);
    expect(fields({ ...stay, arrivesAt: "2026-12-04 08:00" })).toEqual(["arrivesAt"]);
    expect(fields({ ...stay, arrivesAt: "2026-12-04T24:00" })).toEqual(["arrivesAt"]);
    expect(fields({ ...stay, workdayFrom: "8:00" })).toEqual(["workdayFrom"]);
    expect(fields({ ...stay, workdayTo: "07:00" })).toEqual(["workdayTo"]);
    expect(fields({ ...stay, workdayTo: "24:00" })).toEqual([]);
    expect(fields({ ...stay, engineStop: null })).toEqual([]);
    expect(fields({ ...stay, engineStop: { from: "2026-12-05T08:00", to: "2026-12-05T08:00" } })).toEqual(["engineStop.to"]);
    expect(fields({ ...stay, engineStop: { from: "2026-12-06T08:00", to: "2026-12-06T18:00" } })).toEqual(["engineStop.from"]);
    expect(fields({ ...stay, crew: [...stay.crew, { rank: "motorman", count: 1 }] })).toEqual(["crew.2.rank"]);
    expect(fields({ ...stay, crew: [stay.crew[0], { rank: "motorman", count: 21 }] })).toEqual(["crew.1.count"]);
    expect(fields({ ...stay, watches: [], crew: [stay.crew[0], { rank: "motorman", count: 1.5 }] })).toEqual(["crew.1.count"]);
  });

  it("keeps each port watch to a person on the crew list and to the stay", () => {
    const watch = stay.watches[0]!;
    expect(fields({ ...stay, watches: [{ ...watch, person: 3 }] })).toEqual(["watches.0.person"]);
    expect(fields({ ...stay, watches: [{ ...watch, rank: "third-engineer", person: 1 }] })).toEqual(["watches.0.person"]);
    expect(fields({ ...stay, watches: [{ ...watch, to: watch.from }] })).toEqual(["watches.0.to"]);
    expect(fields({ ...stay, watches: [{ ...watch, from: "2026-12-04T06:00" }] })).toEqual(["watches.0.from"]);
    expect(fields({ ...stay, watches: [{ ...watch, label: " " }] })).toEqual(["watches.0.label"]);
  });

  it("refuses a work order twice in a package, and a person who is not rank#number", () => {
    const id = "0b6f7c1e-8a51-4c1e-9d0e-3f1f2a9b7c11";
    const item = { workOrderId: id, start: "2026-12-04T08:00" };
    expect(fields({ items: [item, { ...item, start: "2026-12-05T08:00" }] }, PackageInput)).toEqual(["items.1.workOrderId"]);
    expect(fields({ items: [{ ...item, people: ["motorman#0"] }] }, PackageInput)).toEqual(["items.0.people.0"]);
    expect(fields({ items: [{ ...item, people: ["motorman#2"] }] }, PackageInput)).toEqual([]);
    expect(fields({ items: [{ ...item, start: "2026-12-04" }] }, PackageInput)).toEqual(["items.0.start"]);
  });
});
