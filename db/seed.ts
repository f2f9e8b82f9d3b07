import { sql } from "drizzle-orm";
import { demoClass, demoShop, demoVehicles } from "./demo";
import { organization, seedRuns, vehicles } from "./schema";
import { scriptDb } from "./scripts-db";

type ScriptDb = ReturnType<typeof scriptDb>["db"];
type Tx = Parameters<Parameters<ScriptDb["transaction"]>[0]>[0];

/** Each demo part loads once, in its own transaction, recorded in seed_runs. */
const parts: { name: string; load: (tx: Tx) => Promise<void> }[] = [
  {
    name: "demo-organisations-v1",
    load: async (tx) => {
      await tx.insert(organization).values([demoShop, demoClass]);
      await tx.insert(vehicles).values(demoVehicles);
    },
  },
];

export async function seedDemo(url?: string): Promise<string[]> {
  const { pool, db } = scriptDb(url);
  const loaded: string[] = [];
  try {
    for (const part of parts) {
      await db.transaction(async (tx) => {
        // Serialise concurrent seeders (two starts at once) on one advisory lock.
        await tx.execute(sql`select pg_advisory_xact_lock(7317001)`);
        const done = await tx.select().from(seedRuns).where(sql`${seedRuns.name} = ${part.name}`);
        if (done.length > 0) return;
        await part.load(tx);
        await tx.insert(seedRuns).values({ name: part.name });
        loaded.push(part.name);
      });
    }
  } finally {
    await pool.end();
  }
  return loaded;
}

if (process.argv[1] && /seed\.ts$/.test(process.argv[1])) {
  seedDemo()
    .then((loaded) => console.info(loaded.length ? `demo data loaded: ${loaded.join(", ")}` : "demo data already present"))
    .catch((err) => {
      console.error("seeding failed:", err instanceof Error ? err.message : err);
      process.exit(1);
    });
}
