import { describe, expect, it } from "vitest";
import { imoCheckDigit, imoProblem, isValidImo, normaliseImo } from "./imo";

// Source for every vector: ../shared/SOURCES.md, "IMO ship identification number" — the scheme of
// IMO Resolution A.1117(30) / SOLAS XI-1/3, weights 7..2 over the first six digits.
describe("IMO check digit", () => {
  it("9074729 is valid: 63+0+35+16+21+4 = 139 → 9 (SOURCES.md, IMO vectors)", () => {
    expect(imoCheckDigit("907472")).toBe(9);
    expect(isValidImo("9074729")).toBe(true);
  });

  it("7654329 is valid: sum 139 → 9 (SOURCES.md, IMO vectors)", () => {
    expect(imoCheckDigit("765432")).toBe(9);
    expect(isValidImo("7654329")).toBe(true);
  });

  it("9241061 is valid: sum 111 → 1 (SOURCES.md, IMO vectors)", () => {
    expect(imoCheckDigit("924106")).toBe(1);
    expect(isValidImo("9241061")).toBe(true);
  });

  it("9241062 and 9074728 are invalid (SOURCES.md, IMO vectors)", () => {
    expect(isValidImo("9241062")).toBe(false);
    expect(isValidImo("9074728")).toBe(false);
    expect(imoProblem("9074728")).toMatch(/last digit must be 9/);
  });

  it("accepts the written form with the IMO prefix", () => {
    expect(normaliseImo(" IMO 9074729 ")).toBe("9074729");
    expect(isValidImo("IMO 9074729")).toBe(true);
  });

  it("refuses anything that is not seven digits", () => {
    expect(imoProblem("907472")).toMatch(/seven digits/);
    expect(imoProblem("90747290")).toMatch(/seven digits/);
    expect(imoProblem("90747a9")).toMatch(/seven digits/);
  });
});
