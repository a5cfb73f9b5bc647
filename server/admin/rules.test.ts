import { describe, expect, it } from "vitest";
import { companyGaps, duplicateVesselErrors, type ExistingVessel, lastAdminError, suggestPassword } from "./rules";

const fleet: ExistingVessel[] = [
  { id: "v1", name: "Aster Gale", code: "AG", imoNumber: "9074729", retiredAt: null },
  { id: "v2", name: "Old Bittern", code: "OB", imoNumber: "7654329", retiredAt: new Date("2025-01-01") },
];

describe("duplicateVesselErrors", () => {
  it("names the vessel that already uses the code or the IMO number", () => {
    expect(duplicateVesselErrors({ code: "AG", imoNumber: "7654329" }, fleet)).toEqual([
      { field: "code", message: "Code AG is already used by Aster Gale." },
      { field: "imoNumber", message: "IMO 7654329 is already registered as Old Bittern (retired)." },
    ]);
  });

  it("lets a vessel keep its own code and number", () => {
    expect(duplicateVesselErrors({ code: "AG", imoNumber: "9074729" }, fleet, "v1")).toEqual([]);
  });
});

describe("lastAdminError", () => {
  const alone = [{ userId: "a1", disabled: false }];

  it("refuses the only administrator demoting or disabling themself", () => {
    expect(lastAdminError(alone, "a1", { role: "engineer" }, "a1")).toMatchObject({
      field: "role",
      message: expect.stringMatching(/only active administrator/),
    });
    expect(lastAdminError(alone, "a1", { disabled: true }, "a1")).toMatchObject({ field: "disabled" });
  });

  it("allows it when another active administrator remains", () => {
    const two = [...alone, { userId: "a2", disabled: false }];
    expect(lastAdminError(two, "a1", { role: "viewer", disabled: true }, "a1")).toBeNull();
  });

  it("does not count a disabled administrator as remaining", () => {
    const withDisabled = [...alone, { userId: "a2", disabled: true }];
    expect(lastAdminError(withDisabled, "a1", { role: "superintendent" }, "a1")?.field).toBe("role");
    // Re-enabling the other one, or keeping the role, is fine.
    expect(lastAdminError(withDisabled, "a2", { disabled: false }, "a1")).toBeNull();
    expect(lastAdminError(alone, "a1", { role: "admin" }, "a1")).toBeNull();
  });

  it("leaves changes to non-administrators alone", () => {
    expect(lastAdminError(alone, "e1", { role: "viewer", disabled: true }, "a1")).toBeNull();
  });
});

describe("suggestPassword", () => {
  it("is four words and a three-digit number, long enough for the 10-character minimum", () => {
    const password = suggestPassword(() => [0, 1, 2, 3, 4]);
    expect(password).toBe("anchor-ballast-beacon-bilge-104");
    expect(password.length).toBeGreaterThanOrEqual(10);
  });
});

describe("companyGaps", () => {
  const person = { vessels: [], isYou: false, disabled: false };
  it("finds unstaffed vessels in service, seagoing people without a vessel, and a sole administrator", () => {
    const gaps = companyGaps(
      [
        { id: "v1", name: "Aster Gale", retiredAt: null, assignedPeople: 0 },
        { id: "v2", name: "Old Bittern", retiredAt: "2025-01-01T00:00:00Z", assignedPeople: 0 },
        { id: "v3", name: "Corran Ness", retiredAt: null, assignedPeople: 2 },
      ],
      [
        { ...person, id: "a1", name: "Ines", role: "admin" },
        { ...person, id: "a2", name: "Former", role: "admin", disabled: true },
        { ...person, id: "s1", name: "Tomasz", role: "superintendent" },
        { ...person, id: "e1", name: "Mika", role: "engineer" },
        { ...person, id: "e2", name: "Jonas", role: "engineer", vessels: ["v3"] },
      ],
    );
    expect(gaps.unstaffedVessels.map((v) => v.id)).toEqual(["v1"]);
    expect(gaps.peopleWithoutVessel.map((p) => p.id)).toEqual(["e1"]);
    expect(gaps.soleAdmin?.id).toBe("a1");
  });
});
