import { execFileSync } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import { Client } from "pg";
import { afterAll, describe, expect, it } from "vitest";

// A scratch cluster of its own, so this test never touches the one the other tests use.
const env = { ...process.env, AMP_PG_NAME: "pg-scratch", AMP_PG_PORT: "54349", AMP_PG_FAST: "1", AMP_PG_DB: "scratch" };
const script = path.resolve("scripts/db.sh");
const run = (cmd: string) => execFileSync("bash", [script, cmd], { env, encoding: "utf8", stdio: ["ignore", "pipe", "pipe"] });

async function selectOne(): Promise<number> {
  const client = new Client({ connectionString: "postgres://ampwright@127.0.0.1:54349/scratch" });
  await client.connect();
  try {
    const { rows } = await client.query<{ one: number }>("select 1 as one");
    return rows[0].one;
  } finally {
    await client.end();
  }
}

afterAll(() => {
  run("destroy");
});

describe("scripts/db.sh", () => {
  it("starts a private cluster on loopback, and a second start reuses it", async () => {
    run("start");
    expect(await selectOne()).toBe(1);
    run("start");
    expect(run("status")).toMatch(/^running /);
    expect(await selectOne()).toBe(1);
  });

  it("recovers from a crash that left a stale postmaster.pid", async () => {
    const dataDir = run("status").trim().replace(/^running /, "");
    const pidFile = path.join(dataDir, "postmaster.pid");
    const pid = Number(fs.readFileSync(pidFile, "utf8").split("\n")[0]);
    process.kill(pid, "SIGKILL");
    for (let i = 0; i < 50 && isAlive(pid); i++) await new Promise((r) => setTimeout(r, 100));
    expect(fs.existsSync(pidFile)).toBe(true);
    run("start");
    expect(await selectOne()).toBe(1);
  });

  it("stops cleanly and says so", () => {
    run("stop");
    expect(run("status")).toMatch(/^stopped /);
  });
});

function isAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}
