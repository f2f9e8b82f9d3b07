import { index, integer, jsonb, pgTable, serial, text, timestamp } from "drizzle-orm/pg-core";

/** A file sent with a message (a report PDF), its bytes as base64. */
export type MailAttachment = { filename: string; contentType: string; contentBase64: string };

/**
 * Mail waiting to be sent. A row is written in the same transaction as the action that causes it; the sender
 * delivers it with retries and backoff, so a mail server that is down loses nothing.
 */
export const mailOutbox = pgTable(
  "mail_outbox",
  {
    id: serial("id").primaryKey(),
    to: text("to_address").notNull(),
    subject: text("subject").notNull(),
    text: text("body_text").notNull(),
    html: text("body_html"),
    attachments: jsonb("attachments").$type<MailAttachment[]>(),
    kind: text("kind").notNull(),
    attempts: integer("attempts").notNull().default(0),
    nextAttemptAt: timestamp("next_attempt_at", { withTimezone: true }).notNull().defaultNow(),
    sentAt: timestamp("sent_at", { withTimezone: true }),
    lastError: text("last_error"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("mail_outbox_due_idx").on(t.sentAt, t.nextAttemptAt)],
);

/** Sign-in and sign-up attempts by client address and e-mail, for the abuse limits. */
export const authAttempts = pgTable(
  "auth_attempts",
  {
    id: serial("id").primaryKey(),
    key: text("key").notNull(),
    at: timestamp("at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("auth_attempts_key_at_idx").on(t.key, t.at)],
);
