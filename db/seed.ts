import { eq, sql } from "drizzle-orm";
import { hashPassword } from "better-auth/crypto";
import { DEMO_PASSWORD, demoClass, demoPeople, demoShop, demoVehicles } from "./demo";
import { sizeCable, summarizeSizing } from "@/lib/conductors";
import { parseSizingInputs, queryFromInputs, SIZING_DEFAULTS } from "@/lib/conductors/sizing-form";
import { DEMO_SHARE_TOKEN, demoJobs, demoLesson, demoOutcomes, demoPlanJobs, demoShopPlan, demoSizings, type DemoJob } from "./demo-work";
import { planSchema } from "@/lib/diagnosis/plans";
import { meterPhoto, storeDemoPhoto } from "./demo-photos";
import { hashShareToken } from "@/lib/report/tokens";
import { account, attachments, auditEvents, circuitRevisions, circuits, jobs, lessonActivity, lessons, lessonVersions, member, organization, organizationPlans, readings, seedRuns, shareLinks, sizings, user, vehicles } from "./schema";
import { scriptDb } from "./scripts-db";

type ScriptDb = ReturnType<typeof scriptDb>["db"];
type Tx = Parameters<Parameters<ScriptDb["transaction"]>[0]>[0];

/** Demo jobs with their circuits, earlier versions and readings, dated back from now. */
async function insertDemoJobs(tx: Tx, list: DemoJob[]) {
  const now = Date.now();
  const ago = (minutes: number) => new Date(now - minutes * 60_000);
  for (const j of list) {
    const at = ago(j.daysAgo * 1440);
    const { circuits: jobCircuits, daysAgo: _d, ...job } = j;
    void _d;
    await tx.insert(jobs).values({ ...job, systemVoltage: 12, createdBy: j.ownerId, updatedBy: j.ownerId, createdAt: at, updatedAt: at });
    await tx.insert(auditEvents).values({ organizationId: j.organizationId, actorId: j.ownerId, action: "job.create", entityType: "job", entityId: j.id, detail: { title: j.title }, createdAt: at });
    for (const c of jobCircuits) {
      const versions = [...(c.earlier ?? []), { document: c.document, message: c.earlier ? "Bracket resistance set from the readings" : "Created" }];
      await tx.insert(circuits).values({ id: c.id, jobId: j.id, name: c.document.name, document: c.document, version: versions.length, createdBy: j.ownerId, updatedBy: j.ownerId, createdAt: at, updatedAt: at });
      await tx.insert(circuitRevisions).values(
        versions.map((v, i) => ({ circuitId: c.id, version: i + 1, name: v.document.name, document: v.document, message: v.message, createdBy: j.ownerId, createdAt: new Date(at.getTime() + i * 60_000) })),
      );
      if (c.readings.length) {
        await tx.insert(readings).values(
          c.readings.map((r, i) => ({
            id: `rdg_${c.id.slice(4)}_${i + 1}`,
            circuitId: c.id,
            stateId: r.stateId,
            positive: r.positive,
            negative: r.negative,
            value: r.value,
            unit: r.unit,
            currentA: r.currentA ?? null,
            note: r.note,
            takenBy: r.by,
            takenAt: ago(r.minutesAgo),
            updatedAt: ago(r.minutesAgo),
          })),
        );
      }
    }
  }
}

/** Each demo part loads once, in its own transaction, recorded in seed_runs. */
/** A part whose load answers false did not load (a service it needs is down) and is tried again next time. */
const parts: { name: string; load: (tx: Tx) => Promise<void | false> }[] = [
  {
    name: "demo-organisations-v1",
    load: async (tx) => {
      await tx.insert(organization).values([demoShop, demoClass]);
      await tx.insert(vehicles).values(demoVehicles);
    },
  },
  {
    name: "demo-people-v1",
    load: async (tx) => {
      // Demo sign-ins exist only on local runs (npm start sets DEMO=1), never in a production deployment.
      if (process.env.NODE_ENV === "production" && process.env.DEMO !== "1") return;
      const hash = await hashPassword(DEMO_PASSWORD);
      const now = new Date();
      for (const p of demoPeople) {
        await tx.insert(user).values({ id: p.id, name: p.name, email: p.email, emailVerified: true, createdAt: now, updatedAt: now });
        await tx.insert(account).values({ id: `acc_${p.id}`, accountId: p.id, providerId: "credential", userId: p.id, password: hash, createdAt: now, updatedAt: now });
        await tx.insert(member).values({ id: `mem_${p.id}`, organizationId: p.org, userId: p.id, role: p.role, createdAt: now });
        // Everyone also has a personal workshop, as a sign-up would give them.
        const personal = `org_personal_${p.id.slice(9)}`;
        await tx.insert(organization).values({ id: personal, name: `${p.name}'s workshop`, slug: `workshop-${p.id.slice(9)}`, kind: "shop" });
        // A moment later than the demo membership, so the demo shop or class is listed (and chosen) first.
        await tx.insert(member).values({ id: `mem_personal_${p.id}`, organizationId: personal, userId: p.id, role: "owner", createdAt: new Date(now.getTime() + 1000) });
      }
    },
  },
  {
    name: "demo-jobs-v1",
    load: async (tx) => {
      // The jobs belong to the demo people, who exist only where their part loaded.
      if (process.env.NODE_ENV === "production" && process.env.DEMO !== "1") return;
      await insertDemoJobs(tx, demoJobs);
    },
  },
  {
    name: "demo-sizings-v1",
    load: async (tx) => {
      if (process.env.NODE_ENV === "production" && process.env.DEMO !== "1") return;
      for (const z of demoSizings) {
        const typed = { ...SIZING_DEFAULTS, ...z.inputs };
        const parsed = parseSizingInputs(typed);
        if (!parsed.ok) throw new Error(`demo sizing ${z.id}: ${JSON.stringify(parsed.errors)}`);
        const at = new Date(Date.now() - z.minutesAgo * 60_000);
        await tx.insert(sizings).values({
          id: z.id,
          jobId: z.jobId,
          title: z.title,
          inputs: Object.fromEntries(new URLSearchParams(queryFromInputs(typed))),
          request: parsed.request,
          answer: summarizeSizing(sizeCable(parsed.request)),
          createdBy: z.by,
          createdAt: at,
        });
      }
    },
  },
  {
    name: "demo-reports-v1",
    load: async (tx) => {
      if (process.env.NODE_ENV === "production" && process.env.DEMO !== "1") return;
      for (const o of demoOutcomes) await tx.update(jobs).set({ findings: o.findings, repair: o.repair }).where(eq(jobs.id, o.jobId));
      await tx.insert(shareLinks).values({
        id: "shr_demo_unit14",
        organizationId: "org_demo_shop",
        jobId: "job_demo_unit14",
        tokenHash: hashShareToken(DEMO_SHARE_TOKEN),
        label: "Fleet manager",
        createdBy: "usr_demo_tech",
      });
    },
  },
  {
    name: "demo-plan-v1",
    load: async (tx) => {
      if (process.env.NODE_ENV === "production" && process.env.DEMO !== "1") return;
      await insertDemoJobs(tx, demoPlanJobs);
    },
  },
  {
    name: "demo-diagnosis-v1",
    load: async (tx) => {
      if (process.env.NODE_ENV === "production" && process.env.DEMO !== "1") return;
      const p = demoShopPlan;
      await tx.insert(organizationPlans).values({ id: p.id, organizationId: p.organizationId, planKey: p.plan.id, plan: planSchema.parse(p.plan), createdBy: p.createdBy });
    },
  },
  {
    // The meter photo Priya took of the ground-side reading on Unit 14, in the object store (needs it running).
    name: "demo-photos-v1",
    load: async (tx) => {
      if (process.env.NODE_ENV === "production" && process.env.DEMO !== "1") return;
      const objectKey = "org_demo_shop/job_demo_unit14/att_demo_unit14_meter";
      const stored = await storeDemoPhoto(objectKey, await meterPhoto("1.69"));
      if (!stored) {
        console.warn("demo photos: the object store is not reachable; they will be added on the next start");
        return false;
      }
      await tx.insert(attachments).values({
        id: "att_demo_unit14_meter",
        organizationId: "org_demo_shop",
        jobId: "job_demo_unit14",
        readingId: "rdg_demo_unit14_charging_4",
        status: "ready",
        objectKey,
        thumbnailKey: stored.thumbnailKey,
        fileName: "ground-side-1.69V.jpg",
        contentType: "image/jpeg",
        sizeBytes: stored.sizeBytes,
        sha256: stored.sha256,
        uploadedBy: "usr_demo_tech",
      });
    },
  },
  {
    name: "demo-lessons-v1",
    load: async (tx) => {
      if (process.env.NODE_ENV === "production" && process.env.DEMO !== "1") return;
      const l = demoLesson;
      const ago = (days: number) => new Date(Date.now() - days * 86_400_000);
      const document = (await tx.select({ document: circuits.document }).from(circuits).where(eq(circuits.id, l.sourceCircuitId)))[0]?.document;
      if (!document) return; // the class's demo job was removed before this part ran
      const last = l.versions[l.versions.length - 1]!;
      await tx.insert(lessons).values({ id: l.id, organizationId: l.organizationId, sourceCircuitId: l.sourceCircuitId, latestVersion: last.version, createdBy: l.publishedBy, createdAt: ago(l.versions[0]!.daysAgo), updatedAt: ago(last.daysAgo) });
      for (const v of l.versions) {
        await tx.insert(lessonVersions).values({ lessonId: l.id, version: v.version, title: v.title, brief: v.brief, questions: v.questions, document, publishedBy: l.publishedBy, publishedAt: ago(v.daysAgo) });
      }
      for (const a of l.activity) {
        await tx.insert(lessonActivity).values({
          lessonId: l.id,
          userId: a.userId,
          openCount: a.openCount,
          lastVersion: a.lastVersion,
          firstOpenedAt: ago(a.daysAgo + 1),
          lastOpenedAt: ago(a.daysAgo),
          copiedAt: a.copyJobId ? ago(a.daysAgo) : null,
          copyJobId: a.copyJobId,
        });
      }
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
        if ((await part.load(tx)) === false) return;
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
