import "server-only";
import { sql } from "drizzle-orm";
import type { Db } from "@/db";

/** Organisations the user owns that have other members: the account cannot go while they depend on it. */
export async function sharedOwnedOrganizations(db: Db, userId: string): Promise<string[]> {
  const res = await db.execute<{ name: string }>(sql`
    select o.name from organization o join member m on m.organization_id = o.id
    where m.user_id = ${userId} and m.role = 'owner'
      and exists (select 1 from member x where x.organization_id = o.id and x.user_id <> ${userId})`);
  return res.rows.map((r) => r.name);
}

/** Deletes the organisations only this user belongs to, with everything in them. */
export async function deleteSoleOrganizations(db: Db, userId: string): Promise<void> {
  await db.execute(sql`
    delete from organization o where exists (select 1 from member m where m.organization_id = o.id and m.user_id = ${userId})
      and not exists (select 1 from member x where x.organization_id = o.id and x.user_id <> ${userId})`);
}
