import { describe, expect, it } from "vitest";
import { estimateFinal } from "./meter-estimate";

describe("estimateFinal: an old meter replaced without a final reading", () => {
  it("adds the hours run since the last reading at the running rate (hand-worked)", () => {
    // Last read 12,000.0 h at 09:00 on 1 Dec; replaced at 21:00 on 3 Dec = 2.5 days at 18.4 h/day = 46 h.
    expect(estimateFinal({ readAt: "2026-12-01T09:00:00Z", meterValue: 12_000 }, new Date("2026-12-03T21:00:00Z"), 18.4)).toEqual({
      value: 12_046,
      ran: 46,
    });
  });

  it("never more than 24 h a day, whatever the rate says (SOURCES.md, running-hour facts: the physical limit)", () => {
    expect(estimateFinal({ readAt: "2026-12-01T00:00:00Z", meterValue: 100 }, new Date("2026-12-02T00:00:00Z"), 30)).toEqual({
      value: 124,
      ran: 24,
    });
  });

  it("no estimate without a last reading, a rate, or a replacement after the last reading", () => {
    expect(estimateFinal(null, new Date(), 10)).toBeNull();
    expect(estimateFinal({ readAt: "2026-12-01T00:00:00Z", meterValue: 1 }, new Date("2026-12-02T00:00:00Z"), 0)).toBeNull();
    expect(estimateFinal({ readAt: "2026-12-01T00:00:00Z", meterValue: 1 }, new Date("2026-11-30T00:00:00Z"), 5)).toBeNull();
  });
});
