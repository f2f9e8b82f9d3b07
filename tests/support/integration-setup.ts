import { runMigrations } from "../../db/migrate";

/** Migrates the throwaway test database once per run (not per file: workers would race). */
export default async function setup() {
  if (!process.env.DATABASE_URL || !/5433\d|test/.test(process.env.DATABASE_URL)) {
    throw new Error("integration tests need DATABASE_URL pointing at the test cluster; run them through `npm test`");
  }
  await runMigrations(process.env.DATABASE_URL);
}
