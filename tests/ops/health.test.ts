// The health check a load balancer polls: no session needed, the database's round trip reported.
import { describe, expect, it } from "vitest";
import { BASE_URL } from "../support/http";

describe("GET /api/health", () => {
  it("answers 200 with the database's round trip, to anyone, with no cookie", async () => {
    const response = await fetch(`${BASE_URL}/api/health`);
    expect(response.status).toBe(200);
    const body = (await response.json()) as { status: string; database: { ms: number } };
    expect(body.status).toBe("ok");
    expect(body.database.ms).toBeGreaterThanOrEqual(0);
    expect(body.database.ms).toBeLessThan(30_000);
  });

  it("takes no body and changes nothing: other methods are not allowed", async () => {
    const response = await fetch(`${BASE_URL}/api/health`, { method: "POST", headers: { origin: BASE_URL } });
    expect(response.status).toBe(405);
  });
});
