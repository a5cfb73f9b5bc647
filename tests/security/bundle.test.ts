// No secret reaches the browser: the built client chunks are read for the values of the secrets
// this test stack runs with (scripts/lib.sh stack_env and demo_env set them) and the demo password.
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { DEMO_PASSWORD } from "@/db/seed/scenario";

const chunksDir = path.resolve(process.env.KEELSON_DIST_DIR ?? ".next-test", "static", "chunks");

function chunkFiles(): string[] {
  return readdirSync(chunksDir, { recursive: true, encoding: "utf8" })
    .filter((name) => name.endsWith(".js"))
    .map((name) => path.join(chunksDir, name));
}

/**
 * The values to look for, by name; unset ones are left out. DATABASE_URL whole: the test cluster's
 * password alone is the word "keelson", which the app's own names contain.
 */
function secrets(): Map<string, string> {
  const found = new Map<string, string>([["the demo password", DEMO_PASSWORD]]);
  for (const name of [
    "BETTER_AUTH_SECRET",
    "KEELSON_S3_SECRET_ACCESS_KEY",
    "KEELSON_SMTP_PASSWORD",
    "DATABASE_URL",
    "KEELSON_DEMO_PASSWORD",
  ]) {
    const value = process.env[name];
    if (value) found.set(name, value);
  }
  return found;
}

describe("the client bundle", () => {
  it("holds no secret of the environment and not the demo password", () => {
    const files = chunkFiles();
    // The build this suite runs against: the app's pages ship many chunks.
    expect(files.length).toBeGreaterThan(10);
    const looked = secrets();
    expect(looked.has("BETTER_AUTH_SECRET")).toBe(true);
    const leaks: string[] = [];
    for (const file of files) {
      const text = readFileSync(file, "utf8");
      for (const [name, value] of looked)
        if (text.includes(value)) leaks.push(`${name} in ${path.relative(chunksDir, file)}`);
    }
    expect(leaks).toEqual([]);
  });
});
