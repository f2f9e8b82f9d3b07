import { drizzle } from "drizzle-orm/node-postgres";
import { Pool } from "pg";
import * as schema from "./schema";

/** A short-lived connection for command-line scripts (migrate, seed); the server uses db/index.ts. */
export function scriptDb(url = process.env.DATABASE_URL ?? "postgres://ampwright@127.0.0.1:54329/ampwright") {
  const pool = new Pool({ connectionString: url, max: 2 });
  return { pool, db: drizzle(pool, { schema }) };
}
