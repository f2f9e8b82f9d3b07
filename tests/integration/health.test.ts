import { describe, expect, it } from "vitest";
import { GET } from "@/app/api/health/route";

describe("GET /api/health", () => {
  it("reports the test database as up", async () => {
    const res = await GET();
    expect(res.status).toBe(200);
    const body = (await res.json()) as { status: string; database: { status: string; latencyMs: number } };
    expect(body.status).toBe("ok");
    expect(body.database.status).toBe("up");
    expect(body.database.latencyMs).toBeGreaterThanOrEqual(0);
  });
});
