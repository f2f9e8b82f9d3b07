import { Pool } from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as circuitLesson from "@/app/api/v1/circuits/[circuitId]/lesson/route";
import * as circuitRoute from "@/app/api/v1/circuits/[circuitId]/route";
import * as jobCircuits from "@/app/api/v1/jobs/[jobId]/circuits/route";
import * as jobRoute from "@/app/api/v1/jobs/[jobId]/route";
import * as jobsRoute from "@/app/api/v1/jobs/route";
import * as lessonActivity from "@/app/api/v1/lessons/[lessonId]/activity/route";
import * as lessonCopy from "@/app/api/v1/lessons/[lessonId]/copy/route";
import * as lessonRoute from "@/app/api/v1/lessons/[lessonId]/route";
import * as lessonsRoute from "@/app/api/v1/lessons/route";
import { DEMO_PASSWORD, demoClass, demoShop } from "@/db/demo";
import { benchTrainer, demoLesson, pickupCharging } from "@/db/demo-work";
import { seedDemo } from "@/db/seed";
import { callRoute, removeTestJobs, signInCookie } from "../support/sessions";

type Handler = Parameters<typeof callRoute>[0];
const h = (f: unknown) => f as Handler;
const pool = new Pool({ connectionString: process.env.DATABASE_URL });
const who: Record<string, string> = {};
let circuitId = "";
let lessonId = "";

const open = (name: string, id: string, query = "") => callRoute(h(lessonRoute.GET), { path: `/api/v1/lessons/${id}${query}`, params: { lessonId: id }, cookie: who[name] });
const copy = (name: string, id: string, query = "") => callRoute(h(lessonCopy.POST), { method: "POST", path: `/api/v1/lessons/${id}/copy${query}`, params: { lessonId: id }, cookie: who[name] });
const publish = (name: string, cid: string, json: unknown) => callRoute(h(circuitLesson.POST), { json, params: { circuitId: cid }, cookie: who[name] });

async function newCircuit(name: string, organizationId: string, document: unknown) {
  const job = await callRoute(h(jobsRoute.POST), { json: { organizationId, title: "Lesson source" }, cookie: who[name] });
  const jobId = (await job.json()).job.id;
  const c = await callRoute(h(jobCircuits.POST), { json: { document }, params: { jobId }, cookie: who[name] });
  return (await c.json()).circuit.id as string;
}

beforeAll(async () => {
  await seedDemo(process.env.DATABASE_URL);
  for (const [name, email] of Object.entries({ lena: "lena@fernmoor.example", jonah: "jonah@fernmoor.example", ines: "ines@fernmoor.example", ruth: "ruth@fernmoor.example", priya: "priya@larkspur.example", dana: "dana@larkspur.example" })) {
    who[name] = await signInCookie(email, DEMO_PASSWORD);
  }
  circuitId = await newCircuit("lena", demoClass.id, { ...benchTrainer, name: "Lesson source circuit" });
});

afterAll(async () => {
  if (lessonId) await pool.query("delete from lessons where id = $1", [lessonId]);
  await removeTestJobs(pool);
  await pool.end();
});

describe("lessons: publish, open, copy, activity", () => {
  it("publishes a circuit to the class and republishes it as a new version, keeping the first", async () => {
    const first = await publish("lena", circuitId, { title: "Ground-side drop", brief: "Predict, then measure." });
    expect(first.status).toBe(201);
    lessonId = (await first.json()).lesson.id;
    expect(lessonId).toMatch(/^lsn_/);

    // The source changes after publishing: the published snapshot does not.
    const current = await (await callRoute(h(circuitRoute.GET), { params: { circuitId }, cookie: who.lena })).json();
    const changed = { ...current.circuit.document, name: "Changed after publishing" };
    const put = await (circuitRoute.PUT as unknown as Handler)(
      new Request(`${process.env.APP_URL ?? "http://127.0.0.1:3100"}/api/v1/circuits/${circuitId}`, {
        method: "PUT",
        headers: { origin: process.env.APP_URL ?? "http://127.0.0.1:3100", "content-type": "application/json", "if-match": '"1"', cookie: who.lena },
        body: JSON.stringify({ document: changed }),
      }),
      { params: Promise.resolve({ circuitId }) },
    );
    expect(put.status).toBe(200);

    const again = await publish("jonah", circuitId, { title: "Ground-side drop", brief: "Predict, then measure.", questions: [{ prompt: "Which joint drops the most?" }] });
    expect(again.status).toBe(200);
    expect((await again.json()).lesson).toMatchObject({ id: lessonId, version: 2 });

    const v1 = await (await open("ines", lessonId, "?version=1")).json();
    expect(v1.snapshot).toMatchObject({ version: 1, questions: [] });
    expect(v1.snapshot.document.name).toBe("Lesson source circuit");
    const latest = await (await open("ines", lessonId)).json();
    expect(latest.snapshot.version).toBe(2);
    expect(latest.snapshot.document.name).toBe("Changed after publishing");
    expect(latest.versions.map((v: { version: number }) => v.version)).toEqual([2, 1]);
    expect(latest.lesson).toMatchObject({ canManage: false, canCopy: true, myCopyJobId: null });

    const state = await (await callRoute(h(circuitLesson.GET), { params: { circuitId }, cookie: who.lena })).json();
    expect(state).toMatchObject({ canPublish: true, lesson: { id: lessonId, latestVersion: 2, questions: [{ prompt: "Which joint drops the most?" }] } });
  });

  it("says what to fix: a missing title, a blank question, an empty circuit, a shop, a student", async () => {
    const bad = await publish("lena", circuitId, { title: "x", questions: [{ prompt: "" }], extra: 1 });
    expect(bad.status).toBe(422);
    const paths = (await bad.json()).error.issues.map((i: { path: string }) => i.path).sort();
    expect(paths).toEqual(["(body)", "questions.0.prompt", "title"].sort());

    const empty = await newCircuit("lena", demoClass.id, { schema: "ampwright.circuit/1", name: "Nothing drawn", systemVoltage: 12, components: [], wires: [] });
    const emptyRes = await publish("lena", empty, { title: "Empty lesson" });
    expect(emptyRes.status).toBe(422);
    expect((await emptyRes.json()).error.message).toContain("no parts");

    const shopCircuit = await newCircuit("dana", demoShop.id, pickupCharging);
    const shop = await publish("dana", shopCircuit, { title: "Shop lesson" });
    expect(shop.status).toBe(403);
    expect((await shop.json()).error.message).toContain("Lessons belong to classes");

    const own = await newCircuit("ines", demoClass.id, benchTrainer);
    const student = await publish("ines", own, { title: "Student lesson" });
    expect(student.status).toBe(403);
    expect((await student.json()).error.message).toContain("Student");
    expect((await (await callRoute(h(circuitLesson.GET), { params: { circuitId: own }, cookie: who.ines })).json()).canPublish).toBe(false);
  });

  it("lists lessons to the class, with counts only for instructors, and hides them from everyone else", async () => {
    const ines = (await (await callRoute(h(lessonsRoute.GET), { cookie: who.ines })).json()).lessons;
    const mine = ines.find((l: { id: string }) => l.id === lessonId);
    expect(mine).toMatchObject({ title: "Ground-side drop", latestVersion: 2, questionCount: 1, canManage: false, openedCount: null });
    expect(ines.map((l: { id: string }) => l.id)).toContain(demoLesson.id);
    const lena = (await (await callRoute(h(lessonsRoute.GET), { cookie: who.lena })).json()).lessons;
    expect(lena.find((l: { id: string }) => l.id === lessonId)).toMatchObject({ canManage: true, openedCount: 1, copiedCount: 0 });
    expect((await (await callRoute(h(lessonsRoute.GET), { cookie: who.priya })).json()).lessons).toEqual([]);
    expect((await open("priya", lessonId)).status).toBe(404);
    expect((await callRoute(h(lessonRoute.GET), { params: { lessonId } })).status).toBe(401);
    expect((await open("ines", lessonId, "?version=9")).status).toBe(404);
    expect((await open("ines", lessonId, "?version=two")).status).toBe(422);
  });

  it("makes a student's own copy as a job of theirs, and shows the instructor who opened and copied", async () => {
    const res = await copy("ines", lessonId, "?version=1");
    expect(res.status).toBe(201);
    const { copy: made } = await res.json();
    const job = await (await callRoute(h(jobRoute.GET), { params: { jobId: made.jobId }, cookie: who.ines })).json();
    expect(job.job).toMatchObject({ title: "Ground-side drop (my copy)", ownerId: "usr_demo_student1", canEdit: true });
    const circuit = await (await callRoute(h(circuitRoute.GET), { params: { circuitId: made.circuitId }, cookie: who.ines })).json();
    expect(circuit.circuit.document.name).toBe("Lesson source circuit");
    // Another student cannot see it: it is Ines's own work.
    expect((await callRoute(h(jobRoute.GET), { params: { jobId: made.jobId }, cookie: await signInCookie("theo@fernmoor.example", DEMO_PASSWORD) })).status).toBe(404);

    expect((await copy("ruth", lessonId)).status).toBe(403);
    expect((await open("ruth", lessonId)).status).toBe(200);

    const activity = await callRoute(h(lessonActivity.GET), { params: { lessonId }, cookie: who.lena });
    expect(activity.status).toBe(200);
    const people = (await activity.json()).people as { name: string; openCount: number; copyJobId: string | null; roleLabel: string; lastVersion: number | null }[];
    const inesRow = people.find((p) => p.name === "Ines Karlsen")!;
    expect(inesRow).toMatchObject({ copyJobId: made.jobId, roleLabel: "Student", lastVersion: 1 });
    // Opened twice in the first test (version 1, then the latest); the refused version numbers are not counted.
    expect(inesRow.openCount).toBe(2);
    expect(people.find((p) => p.name === "Theo Marsh")).toMatchObject({ openCount: 0, copyJobId: null });
    expect((await callRoute(h(lessonActivity.GET), { params: { lessonId }, cookie: who.ines })).status).toBe(403);
  });

  it("withdraws a lesson for instructors only; students keep their copies", async () => {
    expect((await callRoute(h(lessonRoute.DELETE), { method: "DELETE", params: { lessonId }, cookie: who.ines })).status).toBe(403);
    const copies = await pool.query("select copy_job_id from lesson_activity where lesson_id = $1 and copy_job_id is not null", [lessonId]);
    expect((await callRoute(h(lessonRoute.DELETE), { method: "DELETE", params: { lessonId }, cookie: who.jonah })).status).toBe(204);
    expect((await open("ines", lessonId)).status).toBe(404);
    const kept = await pool.query("select id from jobs where id = $1", [copies.rows[0].copy_job_id]);
    expect(kept.rowCount).toBe(1);
    lessonId = "";
  });
});
