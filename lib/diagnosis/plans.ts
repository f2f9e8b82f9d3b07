import { z } from "zod";
import { stateIdsOf, type CircuitDocument, type Component } from "@/lib/circuit";
import { solveCircuit } from "@/lib/solver";
import { checkReadings, type Reading } from "./compare";
import { againstLimit, chargingWindowAtV, crankingFloorV, effectiveLimits, halfDigitV, REFERENCE_TEMP_C, restVoltageForSoc, stateOfChargePercent, type LimitCheck, type Limits } from "./limits";
import { locateFault, type Suspect } from "./locate";

/**
 * Guided test plans as data: each step names where the red and black leads go (by the part's role, so one plan
 * fits every circuit drawn with those parts), the operating state, what a good reading is (a rule), and what a bad
 * one points at. The plan's verdict is the first failing step in the plan's order: battery, then feeds, then the
 * drops on each side, then the unit itself, which is the order of the trade's method.
 */

/** A lead's place: a terminal of the circuit's first part of a kind. */
export const probeSchema = z.strictObject({ kind: z.enum(["battery", "alternator", "starter"]), terminal: z.enum(["pos", "neg", "out", "case", "in"]) });
export type Probe = z.infer<typeof probeSchema>;

/** The operating state a step is read in; each is found among the circuit's states (see stateFor). */
export const PLAN_STATES = ["rest", "key-on", "charging", "cranking"] as const;
export type PlanState = (typeof PLAN_STATES)[number];

export const ruleSchema = z.discriminatedUnion("kind", [
  /** A rested battery's state of charge from its open-circuit voltage, at least this many percent. */
  z.strictObject({ kind: z.literal("soc-at-least"), percent: z.number().min(0).max(100) }),
  /** A voltage inside the charging window of the system (the 12 V figures, scaled), widened for the temperature. */
  z.strictObject({ kind: z.literal("charging-window") }),
  /** The battery under the cranking load at least the load-test floor for its temperature (battery makers' table). */
  z.strictObject({ kind: z.literal("cranking-floor") }),
  /** A drop no larger than a named limit (volts), the sign ignored. */
  z.strictObject({ kind: z.literal("drop-at-most"), limit: z.enum(["crankPositiveV", "crankGroundV", "chargeSideV", "connectionV"]) }),
  /** A voltage at least this fraction of the system voltage (e.g. the battery while cranking). */
  z.strictObject({ kind: z.literal("at-least-fraction"), fraction: z.number().min(0).max(2) }),
  /** Within this many volts of the battery's rested reading (a feed that reaches its part). */
  z.strictObject({ kind: z.literal("near-rest"), withinV: z.number().min(0) }),
]);
export type Rule = z.infer<typeof ruleSchema>;

export const VERDICTS = ["battery", "feed", "cable", "joint", "ground", "unit", "none"] as const;
export type VerdictKind = (typeof VERDICTS)[number];

export const planStepSchema = z.strictObject({
  id: z.string().min(1).max(40),
  title: z.string().min(1).max(120),
  state: z.enum(PLAN_STATES),
  /** How to set the vehicle up, in words (engine speed, loads). */
  setup: z.string().max(400),
  red: probeSchema,
  black: probeSchema,
  rule: ruleSchema,
  /** What a good reading looks like, in words, with the figure's source. */
  good: z.string().max(400),
  /** What a bad reading points at, and why. */
  fails: z.strictObject({ verdict: z.enum(VERDICTS), side: z.enum(["positive", "ground"]).optional(), why: z.string().max(400) }),
});
export type PlanStep = z.infer<typeof planStepSchema>;

export const planSchema = z.strictObject({
  id: z
    .string({ error: "id must be text" })
    .min(2, "give the plan an id of at least 2 characters")
    .max(40, "id is at most 40 characters")
    .regex(/^[a-z0-9-]+$/, "id may hold only lower-case letters, digits and dashes (e.g. fleet-charging)"),
  name: z.string().min(1).max(120),
  /** The complaint it answers. */
  complaint: z.string().max(300),
  steps: z.array(planStepSchema).min(1).max(30),
  /** The verdict when every step reads good. */
  allGood: z.string().max(400),
});
export type Plan = z.infer<typeof planSchema>;

const p = (kind: Probe["kind"], terminal: Probe["terminal"]): Probe => ({ kind, terminal });

/** The first check of every plan: the rested battery's state of charge (BCI open-circuit table, 75 % or more). */
const restStep = (setup: string, why: string): PlanStep => ({
  id: "rest",
  title: "Battery at rest",
  state: "rest",
  setup,
  red: p("battery", "pos"),
  black: p("battery", "neg"),
  rule: { kind: "soc-at-least", percent: 75 },
  good: "About 12.45 V or more on a 12 V battery: 75 % charged or better (Battery Council International open-circuit table).",
  fails: { verdict: "battery", why },
});

/** The two plans every organisation starts with. Figures are common practice unless a source is named. */
export const BUILT_IN_PLANS: Plan[] = [
  {
    id: "charging",
    name: "Charging system",
    complaint: "Battery light on, battery goes flat, dim lights at idle",
    allGood: "Every check reads good: the battery, its feed and both sides of the charging circuit are sound. A battery light with these readings points at the lamp or sense circuit; follow the vehicle maker's service information.",
    steps: [
      restStep(
        "Key off, engine off, loads off; the vehicle has stood for an hour or more (or the surface charge was removed).",
        "A battery below 75 % at rest must be charged and tested before the charging system is judged: a flat battery makes a good alternator look bad (common practice).",
      ),
      {
        id: "feed",
        title: "B+ feed reaches the alternator",
        state: "key-on",
        setup: "Key on, engine off.",
        red: p("alternator", "out"),
        black: p("battery", "neg"),
        rule: { kind: "near-rest", withinV: 0.5 },
        good: "Within 0.5 V of the battery's rested reading: the output cable and its fuse are intact (common practice, no source).",
        fails: { verdict: "feed", why: "Battery voltage does not reach the alternator's output stud: an open or badly corroded output cable, fuse or fusible link." },
      },
      {
        id: "positive",
        title: "Positive side drop while charging",
        state: "charging",
        setup: "Engine running at about 2000 rpm with headlamps, blower and rear defrost on, so the alternator carries a real load.",
        red: p("alternator", "out"),
        black: p("battery", "pos"),
        rule: { kind: "drop-at-most", limit: "chargeSideV" },
        good: "0.3 V or less from the alternator's output stud to the battery's positive post (common practice: 0.2 to 0.3 V).",
        fails: { verdict: "cable", side: "positive", why: "Too much of the alternator's voltage is lost on the way to the battery: a cable, fuse or joint on the positive side has resistance it should not." },
      },
      {
        id: "ground",
        title: "Ground side drop while charging",
        state: "charging",
        setup: "Same load and speed as the positive side check.",
        red: p("battery", "neg"),
        black: p("alternator", "case"),
        rule: { kind: "drop-at-most", limit: "chargeSideV" },
        good: "0.3 V or less from the battery's negative post to the alternator's case (common practice: 0.2 to 0.3 V).",
        fails: { verdict: "ground", side: "ground", why: "The alternator's return path to the battery has resistance: a ground strap, the engine's ground cable, or the mounting bracket's joint." },
      },
      {
        id: "output",
        title: "Charging voltage at the battery",
        state: "charging",
        setup: "Same load and speed; read at the battery posts.",
        red: p("battery", "pos"),
        black: p("battery", "neg"),
        rule: { kind: "charging-window" },
        good: "About 13.5 to 14.8 V on a 12 V system, double on 24 V (common practice; the regulator's set point varies with temperature and maker).",
        fails: { verdict: "unit", why: "With the battery, the feed and both sides of the circuit sound, a charging voltage outside the window puts the fault in the alternator or its regulator." },
      },
    ],
  },
  {
    id: "starting",
    name: "Starting system",
    complaint: "Slow crank, click but no crank, no-start",
    allGood: "Every check reads good: the battery holds up and both sides of the starting circuit are sound. A slow crank with these readings points at the starter motor or the engine itself; follow the vehicle maker's service information.",
    steps: [
      restStep(
        "Key off, loads off; the vehicle has stood for an hour or more.",
        "A battery below 75 % at rest cannot be judged under the cranking load: charge it and load-test it first (common practice).",
      ),
      {
        id: "crank-volts",
        title: "Battery voltage while cranking",
        state: "cranking",
        setup: "Disable the fuel or ignition as the maker's service information says, then crank for no more than 15 seconds.",
        red: p("battery", "pos"),
        black: p("battery", "neg"),
        rule: { kind: "cranking-floor" },
        good: "9.6 V or more on a 12 V battery while cranking at 21 C and above, falling to 8.5 V at -18 C (the battery makers' load-test table).",
        fails: { verdict: "battery", why: "The battery's voltage collapses under the cranking load: a weak or failing battery (or one of a bank), or a starter drawing far too much current." },
      },
      {
        id: "positive",
        title: "Positive side drop while cranking",
        state: "cranking",
        setup: "Crank as before.",
        red: p("battery", "pos"),
        black: p("starter", "in"),
        rule: { kind: "drop-at-most", limit: "crankPositiveV" },
        good: "0.5 V or less from the battery's positive post to the starter's main terminal (common practice).",
        fails: { verdict: "cable", side: "positive", why: "The starter's feed loses too much voltage: a cable, a lug, a relay or solenoid contact on the positive side." },
      },
      {
        id: "ground",
        title: "Ground side drop while cranking",
        state: "cranking",
        setup: "Crank as before.",
        red: p("starter", "case"),
        black: p("battery", "neg"),
        rule: { kind: "drop-at-most", limit: "crankGroundV" },
        good: "0.2 V or less from the starter's case to the battery's negative post (common practice).",
        fails: { verdict: "ground", side: "ground", why: "The starter's return path has resistance: the engine ground cable, a frame joint or the starter's mounting." },
      },
    ],
  },
];

export const planById = (id: string) => BUILT_IN_PLANS.find((x) => x.id === id);

/** The circuit's terminal for a probe: the first part of that kind, or undefined when there is none. */
export function terminalFor(doc: CircuitDocument, probe: Probe): string | undefined {
  const c = doc.components.find((x) => x.kind === probe.kind);
  return c ? `${c.id}.${probe.terminal}` : undefined;
}

const enabledIn = (doc: CircuitDocument, stateId: string, c: Component) => {
  const set = doc.states?.find((s) => s.id === stateId)?.set[c.id] as { enabled?: boolean } | undefined;
  return set?.enabled ?? (c as { enabled?: boolean }).enabled ?? true;
};

/**
 * The circuit state a plan state is read in: charging, the first state with an alternator running; cranking, the
 * first with a starter turning; key on, a state named so (else the base); rest, the base with nothing running.
 */
export function stateFor(doc: CircuitDocument, state: PlanState): string | undefined {
  const ids = stateIdsOf(doc);
  const running = (kind: string, id: string) => doc.components.some((c) => c.kind === kind && enabledIn(doc, id, c));
  if (state === "charging") return ids.find((id) => running("alternator", id));
  if (state === "cranking") return ids.find((id) => running("starter", id));
  if (state === "key-on") return doc.states?.find((s) => /key.?on|koeo/i.test(`${s.id} ${s.name}`))?.id ?? "base";
  return "base";
}

export type StepResult = {
  step: PlanStep;
  /** Where the leads go in this circuit and in which of its states; absent when the circuit lacks a part or state. */
  positive?: string;
  negative?: string;
  stateId?: string;
  missing?: string;
  /** The latest reading recorded for this step (same two points and state), in volts as the red lead sees it. */
  readingId?: string;
  measuredV?: number;
  /** "cannot-tell": the reading's digits straddle the limit; read it again with one more digit. */
  status: "not-read" | "good" | "bad" | "cannot" | "cannot-tell";
  /** The figure the reading was judged by, in words. */
  judged?: string;
};

export type PlanVerdict = {
  kind: VerdictKind | "incomplete";
  title: string;
  reasons: string[];
  /** The part the readings blame most, with its estimated extra resistance, when a side's drop failed. */
  suspect?: Suspect;
  /** Parts on the failing side to measure across one at a time, when the readings cannot yet name one. */
  walk?: { id: string; positive: string; negative: string }[];
  stateId?: string;
};

const fmt = (v: number) => `${v.toFixed(v < 1 ? 3 : 2)} V`;
const fmtLimit = (v: number) => `${+v.toFixed(2)} V`;
const fmtStep = (half: number) => (2 * half >= 0.001 ? `${+(2 * half).toPrecision(1)} V` : `${+(2 * half * 1000).toPrecision(1)} mV`);

/** Judges each step from the circuit's readings and works out the verdict (see the module's comment for the order). */
export function runPlan(plan: Plan, doc: CircuitDocument, readings: Reading[], limits: Limits = effectiveLimits()): { steps: StepResult[]; verdict: PlanVerdict } {
  const volts = (r: Reading) => (r.unit === "mV" ? r.value / 1000 : r.value);
  const latest = (pos: string, neg: string, stateId: string) => {
    for (let i = readings.length - 1; i >= 0; i--) {
      const r = readings[i]!;
      if (r.stateId !== stateId) continue;
      if (r.positive === pos && r.negative === neg) return { id: r.id, v: volts(r), half: halfDigitV(r.value, r.unit) };
      if (r.positive === neg && r.negative === pos) return { id: r.id, v: -volts(r), half: halfDigitV(r.value, r.unit) };
    }
    return undefined;
  };
  const tempC = doc.ambientC ?? REFERENCE_TEMP_C;
  const atTemp = doc.ambientC === undefined ? "" : ` at ${tempC} C`;
  const rest = (() => {
    const step = plan.steps.find((s) => s.rule.kind === "soc-at-least");
    const pos = step && terminalFor(doc, step.red);
    const neg = step && terminalFor(doc, step.black);
    return pos && neg ? latest(pos, neg, "base")?.v : undefined;
  })();

  const steps: StepResult[] = plan.steps.map((step) => {
    const positive = terminalFor(doc, step.red);
    const negative = terminalFor(doc, step.black);
    const stateId = stateFor(doc, step.state);
    if (!positive || !negative) return { step, status: "cannot", missing: `this circuit has no ${!positive ? step.red.kind : step.black.kind}` };
    if (!stateId) return { step, positive, negative, status: "cannot", missing: `this circuit has no ${step.state} state: add one in the workspace (a state with the ${step.state === "charging" ? "alternator" : "starter"} on)` };
    const found = latest(positive, negative, stateId);
    if (!found) return { step, positive, negative, stateId, status: "not-read" };
    const v = found.v;
    const half = found.half;
    const r = step.rule;
    let status: LimitCheck;
    let judged: string;
    if (r.kind === "soc-at-least") {
      // The organisation's own floor, when it set one, stands in for the plan's; judged as a voltage at the digits read.
      const floor = limits.restSocPercent ?? r.percent;
      const floorV = restVoltageForSoc(floor, doc.systemVoltage);
      const soc = stateOfChargePercent(v, doc.systemVoltage);
      status = againstLimit(v, half, floorV, "at-least");
      judged =
        status === "good"
          ? `${fmt(v)} is about ${soc.toFixed(0)} % charged: at least the ${floor} % (${fmtLimit(floorV)}) asked for`
          : status === "bad"
            ? `${fmt(v)} is about ${soc.toFixed(0)} % charged: under the ${floor} % (${fmtLimit(floorV)}) asked for`
            : `${fmt(v)}, read to ${fmtStep(half)}, cannot tell whether it reaches ${floor} % (${fmtLimit(floorV)}): read it again to ${fmtStep(half / 10)}`;
    } else if (r.kind === "charging-window") {
      const [lo, hi] = chargingWindowAtV(doc.systemVoltage, tempC, limits);
      const low = againstLimit(v, half, lo, "at-least");
      const high = againstLimit(v, half, hi, "at-most");
      status = low === "bad" || high === "bad" ? "bad" : low === "cannot-tell" || high === "cannot-tell" ? "cannot-tell" : "good";
      judged = `${fmt(v)} against the window ${lo.toFixed(2)} to ${hi.toFixed(2)} V${atTemp}${low === "bad" ? ": low, not charging enough" : high === "bad" ? ": high, overcharging" : status === "cannot-tell" ? `: at the edge at ${fmtStep(half)}, read it again to ${fmtStep(half / 10)}` : ""}`;
    } else if (r.kind === "cranking-floor") {
      const floor = crankingFloorV(doc.systemVoltage, tempC);
      status = againstLimit(v, half, floor, "at-least");
      judged = `${fmt(v)} against the load-test floor of ${floor.toFixed(2)} V${atTemp || ` at ${REFERENCE_TEMP_C} C`}${status === "cannot-tell" ? `: at the edge at ${fmtStep(half)}` : ""}`;
    } else if (r.kind === "drop-at-most") {
      const limit = limits[r.limit];
      status = againstLimit(Math.abs(v), half, limit, "at-most");
      judged = `a drop of ${fmt(Math.abs(v))} against ${limit} V at most${status === "cannot-tell" ? `: at the edge at ${fmtStep(half)}` : ""}`;
    } else if (r.kind === "at-least-fraction") {
      const floor = r.fraction * doc.systemVoltage;
      status = againstLimit(v, half, floor, "at-least");
      judged = `${fmt(v)} against ${floor.toFixed(1)} V at least`;
    } else {
      if (rest === undefined) return { step, positive, negative, stateId, readingId: found.id, measuredV: v, status: "not-read", judged: "read the battery at rest first: this check compares with it" };
      status = againstLimit(Math.abs(v - rest), half, r.withinV, "at-most");
      judged = `${fmt(v)} against the battery's ${fmt(rest)} at rest (within ${r.withinV} V is good)`;
    }
    return { step, positive, negative, stateId, readingId: found.id, measuredV: v, status, judged };
  });

  const firstBad = steps.find((s) => s.status === "bad");
  const reasons = steps.filter((s) => s.judged && s.status !== "not-read").map((s) => `${s.step.title}: ${s.judged} (${s.status === "good" ? "good" : s.status === "bad" ? "bad" : "cannot tell yet"}).`);
  if (!firstBad) {
    const open = steps.filter((s) => s.status === "not-read" || s.status === "cannot" || s.status === "cannot-tell");
    if (open.length) return { steps, verdict: { kind: "incomplete", title: `${open.length} of ${steps.length} checks still to read`, reasons } };
    return { steps, verdict: { kind: "none", title: "No fault in this circuit", reasons: [...reasons, plan.allGood] } };
  }
  const verdict: PlanVerdict = { kind: firstBad.step.fails.verdict, title: firstBad.step.title, reasons: [...reasons, firstBad.step.fails.why], stateId: firstBad.stateId };
  if (firstBad.step.fails.side && firstBad.stateId) narrowDown(doc, readings, firstBad, verdict);
  return { steps, verdict };
}

/**
 * A failing side: which of its cables and connections carry the extra resistance, from every reading taken in that
 * state (least squares, see locate.ts). Until the readings separate the parts, the verdict lists the parts to
 * measure across one by one (the trade's "walk the path").
 */
function narrowDown(doc: CircuitDocument, readings: Reading[], failed: StepResult, verdict: PlanVerdict) {
  const inState = readings.filter((r) => r.stateId === failed.stateId);
  const check = checkReadings(doc, inState.filter((r) => r.id === failed.readingId))[0];
  const path = check?.spans ?? [];
  const location = locateFault(doc, inState);
  const onPath = location.suspects.filter((s) => path.includes(s.id));
  const top = onPath[0];
  const separated = top && top.twins.filter((t) => path.includes(t)).length === 0;
  if (top && separated) {
    verdict.suspect = top;
    const part = doc.components.find((c) => c.id === top.id);
    const name = part?.label ?? doc.wires.find((w) => w.id === top.id)?.label ?? top.id;
    if (failed.step.fails.side === "positive") verdict.kind = part?.kind === "joint" ? "joint" : part?.kind === "fuse" ? "feed" : "cable";
    verdict.title = `${name} (${top.id}): about ${(top.extraOhm * 1000).toFixed(1)} mΩ more than it should have`;
    verdict.reasons.push(`The readings across the ${failed.step.fails.side} side put the extra resistance in ${top.id}, not in the parts next to it.`);
    return;
  }
  // Walk the path: a reading across each part that can go bad (not the zero-ohm links of the drawing).
  const links = new Set(doc.wires.filter((w) => w.resistanceOhm === 0).map((w) => w.id));
  const measured = new Set(inState.map((r) => [r.positive, r.negative].sort().join("|")));
  // The red lead goes on the end the model puts higher, so the meter reads the drop as a positive number.
  const solved = solveCircuit(doc, { state: failed.stateId });
  verdict.walk = path
    .filter((id) => !links.has(id))
    .map((id) => {
      const w = doc.wires.find((x) => x.id === id);
      const [from, to] = w ? [w.from, w.to] : [`${id}.a`, `${id}.b`];
      const higherFirst = (solved.terminals[from] ?? 0) >= (solved.terminals[to] ?? 0);
      return { id, positive: higherFirst ? from : to, negative: higherFirst ? to : from };
    })
    .filter((s) => !measured.has([s.positive, s.negative].sort().join("|")));
  verdict.reasons.push("The readings so far cover the whole side at once; measure across each part of it to find the one at fault.");
}
