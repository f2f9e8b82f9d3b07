import "server-only";
import { drizzle } from "drizzle-orm/node-postgres";
import { Pool } from "pg";
import { env } from "@/lib/env";
import * as schema from "./schema";

const globalForDb = globalThis as unknown as { ampwrightPool?: Pool };

/** One pool for the whole server process (kept across hot reloads in development). */
export const pool =
  globalForDb.ampwrightPool ??
  new Pool({ connectionString: env().DATABASE_URL, max: 10, idleTimeoutMillis: 30_000, connectionTimeoutMillis: 5_000 });
if (process.env.NODE_ENV !== "production") globalForDb.ampwrightPool = pool;

export const db = drizzle(pool, { schema });
export type Db = typeof db;
