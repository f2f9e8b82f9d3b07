import { z } from "zod";
import { plainText } from "./text";
import { MATERIAL_IDS, findSize } from "@/lib/conductors";

const positive = (what: string) => z.number({ error: `${what} must be a number` }).finite().positive(`${what} must be more than 0`);

/** POST /api/v1/cable-size request: the same schema the sizing form validates with. */
export const cableSizeRequest = z
  .strictObject({
    systemVoltage: positive("systemVoltage").max(1000, "systemVoltage above 1000 V is outside Ampwright's scope"),
    currentA: positive("currentA").max(5000, "currentA above 5000 A is outside the tables"),
    lengthM: positive("lengthM").max(1000, "lengthM above 1000 m is not a vehicle cable run"),
    returnPath: z.enum(["two-wire", "chassis"]).default("two-wire"),
    returnResistanceOhm: z.number().finite().min(0, "returnResistanceOhm cannot be negative").optional(),
    circuitClass: z.enum(["critical", "non-critical"]).default("critical"),
    maxDropPercent: positive("maxDropPercent").max(50).optional(),
    maxDropV: positive("maxDropV").optional(),
    ambientC: z.number().finite().min(-60).max(200).optional(),
    zone: z.enum(["cabin", "engine", "underbody"]).optional(),
    insulationRatingC: z.number().finite().min(60, "insulation rated under 60 C is below the ampacity table").max(250).default(105),
    bundleSize: z.number().int("bundleSize is a whole number of conductors").min(1).max(200).default(1),
    material: z.enum(MATERIAL_IDS as [string, ...string[]], { error: `material must be one of ${MATERIAL_IDS.join(", ")}` }).default("copper"),
    family: z.enum(["awg", "metric"]).default("awg"),
    conductorTemp: z.union([z.enum(["ambient", "rated"]), z.number().finite().min(-60).max(250)]).default("ambient"),
    duty: z
      .discriminatedUnion("kind", [
        z.strictObject({ kind: z.literal("continuous") }),
        z.strictObject({ kind: z.literal("intermittent"), onS: positive("duty.onS"), periodS: positive("duty.periodS") }),
      ])
      .default({ kind: "continuous" }),
    minSize: z
      .string()
      .refine((s) => findSize(s) !== undefined, { message: 'minSize must be a size such as "18 AWG" or "0.5 mm2"' })
      .optional(),
  })
  .superRefine((r, ctx) => {
    if (r.maxDropPercent !== undefined && r.maxDropV !== undefined) {
      ctx.addIssue({ code: "custom", path: ["maxDropV"], message: "give maxDropPercent or maxDropV, not both" });
    }
    if (r.returnPath === "chassis" && r.returnResistanceOhm === undefined) {
      ctx.addIssue({ code: "custom", path: ["returnResistanceOhm"], message: "chassis return needs returnResistanceOhm (the frame and its joints)" });
    }
    if (r.duty.kind === "intermittent" && r.duty.onS > r.duty.periodS) {
      ctx.addIssue({ code: "custom", path: ["duty", "onS"], message: "duty.onS cannot be longer than duty.periodS" });
    }
    if (r.minSize && findSize(r.minSize)?.family !== r.family) {
      ctx.addIssue({ code: "custom", path: ["minSize"], message: `minSize must be a ${r.family === "awg" ? "AWG" : "metric"} size, like the family` });
    }
  });

export type CableSizeRequest = z.infer<typeof cableSizeRequest>;

/** POST /api/v1/jobs/:jobId/sizings: a sizing to keep with a job. The answer is worked out again on the server. */
export const saveSizingInput = z.strictObject({
  title: plainText("title", 120).min(1, "give the sizing a title, e.g. Winch feed"),
  // What was typed on the sizing page, so the saved sizing reopens as it was.
  inputs: z
    .record(z.string().regex(/^[a-zA-Z]{1,30}$/, "input names are letters only"), z.string().max(40, "an input is at most 40 characters"))
    .refine((r) => Object.keys(r).length <= 30, { message: "at most 30 inputs" })
    .default({}),
  request: cableSizeRequest,
});
export type SaveSizingInput = z.infer<typeof saveSizingInput>;
/** The body as a client sends it (defaults may be left out). */
export type SaveSizingBody = z.input<typeof saveSizingInput>;
