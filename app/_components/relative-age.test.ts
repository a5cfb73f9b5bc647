import { describe, expect, it } from "vitest";
import { ageOf } from "./relative-age";

// Keelson's own wording (no published source): the ship's calendar decides "yesterday".
describe("ageOf", () => {
  const now = "2026-12-05T23:00:00Z";
  it.each([
    ["2026-12-05T22:59:40Z", "just now"],
    ["2026-12-05T22:35:00Z", "25 minutes ago"],
    ["2026-12-05T20:00:00Z", "3 hours ago"],
    // 38 hours before 23:00 is 09:00 yesterday: "yesterday", not "2 days ago".
    ["2026-12-04T09:00:00Z", "yesterday"],
    ["2026-12-03T23:30:00Z", "2 days ago"],
    ["2026-11-01T12:00:00Z", "34 days ago"],
  ])("%s is %s at 23:00 UTC", (instant, words) => {
    expect(ageOf(instant, now, "UTC")).toBe(words);
  });

  it("counts days on the ship's calendar", () => {
    // 20:00 UTC on 4 Dec is 04:00 on 5 Dec in Singapore (UTC+8): today there, at 09:00 on 5 Dec (01:00 UTC).
    expect(ageOf("2026-12-04T20:00:00Z", "2026-12-05T01:00:00Z", "Asia/Singapore")).toBe("5 hours ago");
    expect(ageOf("2026-12-04T20:00:00Z", "2026-12-06T01:00:00Z", "Asia/Singapore")).toBe("yesterday");
  });

  it("an early-morning look at last night's reading says hours", () => {
    expect(ageOf("2026-12-04T22:00:00Z", "2026-12-05T02:00:00Z", "UTC")).toBe("4 hours ago");
  });
});
