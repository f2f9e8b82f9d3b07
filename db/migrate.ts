import path from "node:path";
import { migrate } from "drizzle-orm/node-postgres/migrator";
import { scriptDb } from "./scripts-db";

/** Applies the committed migrations in drizzle/ (idempotent: applied ones are skipped). */
export async function runMigrations(url?: string): Promise<void> {
  const { pool, db } = scriptDb(url);
  try {
    await migrate(db, { migrationsFolder: path.join(process.cwd(), "drizzle") });
  } finally {
    await pool.end();
  }
}

if (process.argv[1] && /migrate\.ts$/.test(process.argv[1])) {
  runMigrations()
    .then(() => console.info("migrations applied"))
    .catch((err) => {
      console.error("migration failed:", err instanceof Error ? err.message : err);
      process.exit(1);
    });
}
