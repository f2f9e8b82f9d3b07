import "server-only";
import { and, asc, isNull, lte, sql } from "drizzle-orm";
import type { Db } from "@/db";
import { mailOutbox, type MailAttachment } from "@/db/schema";

export type OutgoingMail = { to: string; subject: string; text: string; html?: string; kind: string; attachments?: MailAttachment[] };
type Executor = Pick<Db, "insert">;

/** Queues a message; pass the transaction of the action that causes it so both commit or neither. */
export async function enqueueMail(db: Executor, mail: OutgoingMail): Promise<void> {
  await db.insert(mailOutbox).values({ to: mail.to, subject: mail.subject, text: mail.text, html: mail.html ?? null, kind: mail.kind, attachments: mail.attachments ?? null });
}

export type DueMail = { id: number; to: string; subject: string; text: string; html: string | null; attachments: MailAttachment[] | null; attempts: number };

/** Claims up to `limit` due messages for this sender (others skip them) by pushing their next attempt out. */
export async function claimDueMail(db: Db, limit = 20): Promise<DueMail[]> {
  return db.transaction(async (tx) => {
    const rows = await tx
      .select({ id: mailOutbox.id, to: mailOutbox.to, subject: mailOutbox.subject, text: mailOutbox.text, html: mailOutbox.html, attachments: mailOutbox.attachments, attempts: mailOutbox.attempts })
      .from(mailOutbox)
      .where(and(isNull(mailOutbox.sentAt), lte(mailOutbox.nextAttemptAt, sql`now()`)))
      .orderBy(asc(mailOutbox.id))
      .limit(limit)
      .for("update", { skipLocked: true });
    if (rows.length) {
      await tx.execute(sql`update mail_outbox set next_attempt_at = now() + interval '60 seconds' where id in ${sql.raw(`(${rows.map((r) => r.id).join(",")})`)}`);
    }
    return rows;
  });
}

export async function markMailSent(db: Db, id: number): Promise<void> {
  await db.execute(sql`update mail_outbox set sent_at = now(), attempts = attempts + 1, last_error = null, attachments = null where id = ${id}`);
}

/** Backoff: 2 s, 4 s, 8 s ... up to 10 minutes between attempts. */
export async function markMailFailed(db: Db, id: number, attempts: number, error: string): Promise<void> {
  const waitS = Math.min(600, 2 ** Math.min(attempts + 1, 10));
  await db.execute(
    sql`update mail_outbox set attempts = attempts + 1, last_error = ${error.slice(0, 500)}, next_attempt_at = now() + make_interval(secs => ${waitS}) where id = ${id}`,
  );
}
