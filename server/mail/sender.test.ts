import { describe, expect, it } from "vitest";
import { messageIdFor, retryDelayMs } from "./sender";

describe("retryDelayMs", () => {
  it("doubles from one minute and stops at six hours", () => {
    // after attempt 1 → 1 min, 2 → 2 min, 3 → 4 min … 9 → 256 min, 10 → 512 min > 360 → capped
    expect([1, 2, 3, 4, 8].map((a) => retryDelayMs(a) / 60_000)).toEqual([1, 2, 4, 8, 128]);
    expect(retryDelayMs(10)).toBe(6 * 3_600_000);
  });
});

describe("messageIdFor", () => {
  it("derives the Message-ID from the row id and the sender's domain", () => {
    expect(messageIdFor("0b6e", "Keelson <keelson@brightwater.example>")).toBe("<0b6e@brightwater.example>");
    expect(messageIdFor("0b6e", "keelson@ship.example")).toBe("<0b6e@ship.example>");
  });
});
