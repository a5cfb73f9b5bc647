import { describe, expect, it } from "vitest";
import { fieldErrorsFromZod } from "@/server/http/problem";
import { PackageInput, PortStayInput } from "./contract";

const stay = {
  port: "Rotterdam",
  arrivesAt: "2026-12-04T08:00",
  departsAt: "2026-12-06T17:00",
  engineMayStop: true,
  immobilisationHours: 36,
  crew: [
    { rank: "second-engineer", manHoursPerDay: 8 },
    { rank: "motorman", manHoursPerDay: 12.5 },
  ],
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

  it("names the field or crew row of each problem", () => {
    expect(fields({ ...stay, departsAt: "2026-12-04T08:00" })).toEqual(["departsAt"]);
    // 4 Dec 08:00 + 30 days = 3 Jan 08:00: one minute more is too long.
    expect(fields({ ...stay, departsAt: "2027-01-03T08:00" })).toEqual([]);
    expect(fields({ ...stay, departsAt: "2027-01-03T08:01" })).toEqual(["departsAt"]);
    expect(fields({ ...stay, arrivesAt: "2026-12-04 08:00" })).toEqual(["arrivesAt"]);
    expect(fields({ ...stay, arrivesAt: "2026-12-04T24:00" })).toEqual(["arrivesAt"]);
    expect(fields({ ...stay, engineMayStop: false })).toEqual(["immobilisationHours"]);
    expect(fields({ ...stay, engineMayStop: false, immobilisationHours: 0 })).toEqual([]);
    expect(fields({ ...stay, crew: [...stay.crew, { rank: "motorman", manHoursPerDay: 1 }] })).toEqual(["crew.2.rank"]);
    expect(fields({ ...stay, crew: [stay.crew[0], { rank: "motorman", manHoursPerDay: 200.1 }] })).toEqual([
      "crew.1.manHoursPerDay",
    ]);
  });

  it("refuses a work order twice in a package", () => {
    const id = "0b6f7c1e-8a51-4c1e-9d0e-3f1f2a9b7c11";
    expect(fields({ items: [{ workOrderId: id, date: "2026-12-04" }, { workOrderId: id, date: "2026-12-05" }] }, PackageInput)).toEqual([
      "items.1.workOrderId",
    ]);
  });
});
