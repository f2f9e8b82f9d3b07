import { pgTable, text, timestamp } from "drizzle-orm/pg-core";

/** One row per demo data set loaded, so a second `npm start` does not load it again. */
export const seedRuns = pgTable("seed_runs", {
  name: text("name").primaryKey(),
  appliedAt: timestamp("applied_at", { withTimezone: true }).notNull().defaultNow(),
});
