import { index, integer, pgTable, real, text, timestamp } from "drizzle-orm/pg-core";
import { organization } from "./organizations";

/** A vehicle a shop works on, or a training vehicle a class uses. */
export const vehicles = pgTable(
  "vehicles",
  {
    id: text("id").primaryKey(),
    organizationId: text("organization_id")
      .notNull()
      .references(() => organization.id, { onDelete: "cascade" }),
    nickname: text("nickname").notNull(),
    description: text("description").notNull().default(""),
    modelYear: integer("model_year"),
    systemVoltage: real("system_voltage").notNull().default(12),
    unitNumber: text("unit_number"),
    odometerKm: integer("odometer_km"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("vehicles_org_idx").on(t.organizationId)],
);
