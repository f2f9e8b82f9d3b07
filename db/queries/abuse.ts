import "server-only";
import { sql } from "drizzle-orm";
import type { Db } from "@/db";

/** Records an attempt and answers how many there were for this key within the window (this one included). */
export async function countAttempt(db: Db, key: string, windowS: number): Promise<number> {
  const res = await db.execute<{ n: string }>(sql`
    with added as (insert into auth_attempts (key) values (${key}) returning 1)
    select count(*) + 1 as n from auth_attempts where key = ${key} and at > now() - make_interval(secs => ${windowS})`);
  // Old rows go now and then, so the table stays small.
  if (Math.random() < 0.01) await db.execute(sql`delete from auth_attempts where at < now() - interval '1 day'`);
  return Number(res.rows[0]?.n ?? 1);
}

/** How many attempts this key has within the window, recording nothing. */
export async function recentAttempts(db: Db, key: string, windowS: number): Promise<number> {
  const res = await db.execute<{ n: string }>(sql`select count(*) as n from auth_attempts where key = ${key} and at > now() - make_interval(secs => ${windowS})`);
  return Number(res.rows[0]?.n ?? 0);
}

/** Forgets a key's attempts (a successful sign-in clears its account's failures). */
export async function clearAttempts(db: Db, key: string): Promise<void> {
  await db.execute(sql`delete from auth_attempts where key = ${key}`);
}

/** The name of the account with this address, if there is one (for the lock notice). */
export async function accountByEmail(db: Db, email: string): Promise<{ name: string; email: string } | undefined> {
  const res = await db.execute<{ name: string; email: string }>(sql`select name, email from "user" where lower(email) = ${email} limit 1`);
  return res.rows[0];
}
