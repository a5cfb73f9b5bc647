import { describe, expect, it } from "vitest";
import { DeferralDecisionInput, DeferralRequestInput } from "./contract";

const reason = "Spares on order; delivery at the next port.";
const fields = (input: unknown) => {
  const result = DeferralRequestInput.safeParse(input);
  return result.success ? [] : result.error.issues.map((i) => i.path.join("."));
};

describe("a deferral request as sent by the form or a script", () => {
  it("takes a limit left out or blank as no value, and hours as typed", () => {
    expect(DeferralRequestInput.parse({ reason, proposedDueHours: "24,500" })).toEqual({
      reason,
      proposedDueDay: null,
      proposedDueHours: 24_500,
    });
    expect(DeferralRequestInput.parse({ reason, proposedDueDay: "2027-01-02", proposedDueHours: "" })).toMatchObject({
      proposedDueDay: "2027-01-02",
      proposedDueHours: null,
    });
  });

  it("names the field that is wrong", () => {
    expect(fields({ reason })).toEqual(["proposedDueDay"]);
    expect(fields({ reason: "  short   ", proposedDueHours: 10 })).toEqual(["reason"]);
    expect(fields({ reason, proposedDueHours: "-5" })).toEqual(["proposedDueHours"]);
    expect(fields({ reason, proposedDueHours: 0 })).toEqual(["proposedDueHours"]);
    expect(fields({ reason, proposedDueDay: "02/01/2027" })).toEqual(["proposedDueDay"]);
  });

  it("wants a note of at least 3 characters to reject, none to approve", () => {
    expect(DeferralDecisionInput.safeParse({ decision: "approve" }).success).toBe(true);
    expect(DeferralDecisionInput.safeParse({ decision: "reject", note: " no " }).success).toBe(false);
    expect(DeferralDecisionInput.safeParse({ decision: "reject", note: "Do it now." }).success).toBe(true);
  });
});
