import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { newNonce, nonceOf, pageSecurityPolicy } from "./content-security-policy";

const directive = (policy: string, name: string) =>
  policy
    .split("; ")
    .find((d) => d.startsWith(`${name} `))
    ?.split(" ")
    .slice(1);

describe("the pages' Content-Security-Policy", () => {
  it("runs only scripts carrying the request's nonce, and no eval, in production", () => {
    const policy = pageSecurityPolicy({ nonce: "abc123", development: false, https: false });
    expect(directive(policy, "script-src")).toEqual(["'self'", "'nonce-abc123'", "'strict-dynamic'"]);
    expect(policy).not.toContain("unsafe-eval");
    expect(directive(policy, "frame-ancestors")).toEqual(["'none'"]);
    expect(directive(policy, "object-src")).toEqual(["'none'"]);
    expect(directive(policy, "base-uri")).toEqual(["'none'"]);
    expect(policy).not.toContain("upgrade-insecure-requests");
  });

  it("allows eval under next dev only, and upgrades stray http:// over https", () => {
    expect(directive(pageSecurityPolicy({ nonce: "n", development: true, https: false }), "script-src")).toContain(
      "'unsafe-eval'",
    );
    expect(pageSecurityPolicy({ nonce: "n", development: false, https: true }).split("; ")).toContain(
      "upgrade-insecure-requests",
    );
  });

  it("gives the nonce back from the policy, for the root layout's theme script", () => {
    const nonce = newNonce();
    expect(nonceOf(pageSecurityPolicy({ nonce, development: false, https: false }))).toBe(nonce);
    expect(nonceOf(null)).toBeUndefined();
  });

  it("makes a fresh 128-bit nonce each time", () => {
    const nonces = new Set(Array.from({ length: 100 }, newNonce));
    expect(nonces.size).toBe(100);
    for (const n of nonces) expect(Buffer.from(n, "base64")).toHaveLength(16);
  });

  it("is the one the root layout's inline script is given (a script without it would not run)", () => {
    const layout = readFileSync("app/layout.tsx", "utf8");
    expect(layout).toMatch(/<script nonce=\{nonce\}/);
    expect(layout.match(/<script\b/g)).toHaveLength(1);
  });
});
