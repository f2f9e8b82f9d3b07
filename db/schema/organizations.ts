import { index, pgTable, text, timestamp } from "drizzle-orm/pg-core";

/**
 * A shop or a class. The column names follow better-auth's organisation plugin so that the accounts
 * layer can use this table as it is; `kind` is Ampwright's own.
 */
export const organization = pgTable(
  "organization",
  {
    id: text("id").primaryKey(),
    name: text("name").notNull(),
    slug: text("slug").notNull().unique(),
    logo: text("logo"),
    metadata: text("metadata"),
    kind: text("kind", { enum: ["shop", "class"] }).notNull().default("shop"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("organization_kind_idx").on(t.kind)],
);
