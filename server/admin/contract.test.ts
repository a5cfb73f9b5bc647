import { describe, expect, it } from "vitest";
import { canonicalTimeZone, UserInput, UserPatch, VesselInput, VesselPatch } from "./contract";

const vessel = { name: "Aster Gale", imoNumber: "9074729", code: "AG", timeZone: "Europe/Oslo" };
const person = {
  name: "Mika Sandoval",
  email: "mika@fleet.example",
  role: "engineer",
  rank: "Second engineer",
  vesselIds: [],
  initialPassword: "long-enough-1",
};

function messageFor(result: { error?: { issues: { path: PropertyKey[]; message: string }[] } }, field: string) {
  return result.error?.issues.find((i) => i.path.join(".") === field)?.message;
}

describe("VesselInput", () => {
  it("normalises the IMO number, the code and the time zone", () => {
    expect(VesselInput.parse({ ...vessel, imoNumber: "IMO 9074729", code: " ag1 ", timeZone: "europe/oslo" })).toEqual({
      name: "Aster Gale",
      imoNumber: "9074729",
      code: "AG1",
      timeZone: "Europe/Oslo",
    });
  });

  // Vectors from ../shared/SOURCES.md, "IMO ship identification number": 9074728 and 9241062 are invalid.
  it.each(["9074728", "IMO 9241062"])("refuses the IMO number %s by its check digit", (imoNumber) => {
    expect(messageFor(VesselInput.safeParse({ ...vessel, imoNumber }), "imoNumber")).toMatch(
      /^IMO number: the check digit does not match/,
    );
  });

  it("refuses an IMO number that is not seven digits", () => {
    expect(messageFor(VesselInput.safeParse({ ...vessel, imoNumber: "907472" }), "imoNumber")).toMatch(
      /exactly seven digits/,
    );
  });

  it.each(["A", "TOOLONG", "A-B", "ÅG"])("refuses the code %j", (code) => {
    expect(messageFor(VesselInput.safeParse({ ...vessel, code }), "code")).toMatch(
      /vessel code is 2 to 6 letters or digits/,
    );
  });

  it.each(["Mars/Olympus", "CET", "+05:00", "Europe", ""])("refuses the time zone %j", (timeZone) => {
    expect(messageFor(VesselInput.safeParse({ ...vessel, timeZone }), "timeZone")).toMatch(
      /^Time zone: .* is not an IANA time zone/,
    );
  });

  it("refuses a name of one letter and one of 81", () => {
    expect(messageFor(VesselInput.safeParse({ ...vessel, name: " A " }), "name")).toMatch(
      /vessel name needs at least 2/,
    );
    expect(messageFor(VesselInput.safeParse({ ...vessel, name: "x".repeat(81) }), "name")).toMatch(/80 characters/);
  });

  it("names every missing field", () => {
    const fields = VesselInput.safeParse({}).error?.issues.map((i) => i.path.join("."));
    expect(fields).toEqual(["name", "imoNumber", "code", "timeZone"]);
  });
});

describe("VesselPatch", () => {
  it("takes any subset and only `retired: false`", () => {
    expect(VesselPatch.parse({ code: "cn" })).toEqual({ code: "CN" });
    expect(VesselPatch.parse({ retired: false })).toEqual({ retired: false });
    expect(VesselPatch.safeParse({ retired: true }).success).toBe(false);
  });
});

describe("canonicalTimeZone", () => {
  it.each([
    ["UTC", "UTC"],
    ["Asia/Singapore", "Asia/Singapore"],
    ["america/new_york", "America/New_York"],
    ["America/Argentina/Buenos_Aires", "America/Argentina/Buenos_Aires"],
    ["utc", "UTC"],
  ])("%s → %s", (input, expected) => {
    expect(canonicalTimeZone(input)).toBe(expected);
  });
});

describe("UserInput", () => {
  it("lower-cases the e-mail, empties the rank to null, defaults no vessels", () => {
    const { vesselIds: _vesselIds, ...withoutVessels } = person;
    expect(UserInput.parse({ ...withoutVessels, email: " Mika@Fleet.Example ", rank: "  " })).toMatchObject({
      email: "mika@fleet.example",
      rank: null,
      vesselIds: [],
    });
  });

  it.each([
    ["email", { email: "mika@" }, /e-mail address does not look right/],
    ["role", { role: "captain" }, /Pick a role: admin, superintendent/],
    ["initialPassword", { initialPassword: "short-pw" }, /at least 10 characters/],
    ["vesselIds.0", { vesselIds: ["not-a-uuid"] }, /Vessel assignments: this is not a vessel id/],
    ["rank", { rank: "r".repeat(61) }, /rank to 60 characters/],
  ])("names the field %s", (field, change, message) => {
    expect(messageFor(UserInput.safeParse({ ...person, ...change }), field)).toMatch(message);
  });
});

describe("UserPatch", () => {
  it("takes any subset, and an empty rank clears it", () => {
    expect(UserPatch.parse({ disabled: true })).toEqual({ disabled: true });
    expect(UserPatch.parse({ rank: "" })).toEqual({ rank: null });
    expect(messageFor(UserPatch.safeParse({ newPassword: "123" }), "newPassword")).toMatch(/at least 10/);
    expect(messageFor(UserPatch.safeParse({ disabled: "yes" }), "disabled")).toMatch(/true or false/);
  });
});
