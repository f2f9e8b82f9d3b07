import { sql } from "drizzle-orm";
import { db } from "@/db";

export const dynamic = "force-dynamic";

// GET /api/health - the app is up and whether PostgreSQL answers
export async function GET() {
  const started = performance.now();
  let database: { status: "up" | "down"; latencyMs?: number; message?: string };
  try {
    await db.execute(sql`select 1`);
    database = { status: "up", latencyMs: Math.round((performance.now() - started) * 10) / 10 };
  } catch {
    database = { status: "down", message: "PostgreSQL did not answer; is scripts/db.sh start running?" };
  }
  const body = { status: database.status === "up" ? "ok" : "degraded", database, time: new Date().toISOString() };
  return Response.json(body, { status: database.status === "up" ? 200 : 503, headers: { "cache-control": "no-store" } });
}
