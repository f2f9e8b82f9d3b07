import { Pool } from "pg";
import { afterAll, describe, expect, it } from "vitest";
import { seedDemo } from "@/db/seed";

const pool = new Pool({ connectionString: process.env.DATABASE_URL });
afterAll(() => pool.end());

async function count(table: string): Promise<number> {
  const { rows } = await pool.query<{ n: string }>(`select count(*) as n from ${table}`);
  return Number(rows[0].n);
}

describe("demo data", () => {
  it("loads once: a second and a concurrent third seeding add nothing", async () => {
    await seedDemo(process.env.DATABASE_URL);
    const orgs = await count("organization");
    const vehicles = await count("vehicles");
    expect(orgs).toBeGreaterThanOrEqual(2);
    expect(vehicles).toBeGreaterThanOrEqual(4);
    const again = await Promise.all([seedDemo(process.env.DATABASE_URL), seedDemo(process.env.DATABASE_URL)]);
    expect(again.flat()).toEqual([]);
    expect(await count("organization")).toBe(orgs);
    expect(await count("vehicles")).toBe(vehicles);
  });

  it("has a shop and a class, and every vehicle belongs to one of them", async () => {
    const { rows } = await pool.query<{ kind: string; n: string }>(
      "select o.kind, count(v.id) as n from organization o left join vehicles v on v.organization_id = o.id group by o.kind order by o.kind",
    );
    expect(rows.map((r) => r.kind)).toEqual(["class", "shop"]);
    expect(rows.every((r) => Number(r.n) > 0)).toBe(true);
  });
});
