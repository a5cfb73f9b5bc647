import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { DEMO_PASSWORD } from "./scenario";

describe("the demo password", () => {
  it("is the one scripts/lib.sh gives the web for its sign-in page (KEELSON_DEMO_PASSWORD)", () => {
    const lib = readFileSync(path.resolve(import.meta.dirname, "../../scripts/lib.sh"), "utf8");
    expect(/export KEELSON_DEMO_PASSWORD=(\S+)/.exec(lib)?.[1]).toBe(DEMO_PASSWORD);
  });
});
