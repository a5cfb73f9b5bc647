import { describe, expect, it } from "vitest";
import { isPlannable, outsideWindowMessage, plannableDaysInWords } from "./plannable-days";

describe("plannable days", () => {
  const range = { planFrom: "2026-12-03", planUntil: "2027-01-14" };

  it("takes both ends of the window as plannable days", () => {
    expect(isPlannable("2026-12-03", range)).toBe(true);
    expect(isPlannable("2027-01-14", range)).toBe(true);
    expect(isPlannable("2026-12-02", range)).toBe(false);
    expect(isPlannable("2027-01-15", range)).toBe(false);
  });

  it("treats a missing end as no bound on that side", () => {
    expect(isPlannable("1999-01-01", { planFrom: null, planUntil: "2027-01-14" })).toBe(true);
    expect(isPlannable("2099-01-01", { planFrom: "2026-12-03", planUntil: null })).toBe(true);
    expect(plannableDaysInWords({ planFrom: null, planUntil: null })).toBe("on any day");
    expect(plannableDaysInWords({ planFrom: "2026-12-03", planUntil: null })).toBe("from 3 December 2026 on");
    expect(plannableDaysInWords({ planFrom: null, planUntil: "2027-01-14" })).toBe("until 14 January 2027");
  });

  it("says which days are allowed when it refuses one", () => {
    expect(outsideWindowMessage("WO-AG-00012", "2027-01-20", range)).toBe(
      "WO-AG-00012 may be planned from 3 December 2026 to 14 January 2027, inside its tolerance window; 20 January 2027 is outside it.",
    );
  });
});
