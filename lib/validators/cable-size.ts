import { z } from "zod";
import { plainText } from "./text";
import { DEVICE_FAMILIES, MATERIAL_IDS, findSize } from "@/lib/conductors";

const DEVICE_FAMILY_IDS = Object.keys(DEVICE_FAMILIES);

const positive = (what: string) => z.number({ error: `${what} must be a number` }).finite().positive(`${what} must be more than 0`);

/** POST /api/v1/cable-size request: the same schema the sizing form validates with. */
export const cableSizeRequest = z
  .strictObject({
    systemVoltage: positive("System voltage").max(1000, "System voltage above 1000 V is outside Ampwright's scope"),
    currentA: positive("Current").max(5000, "Current above 5000 A is outside the tables").optional(),
    powerW: positive("Power").max(100_000, "Power above 100 kW is outside Ampwright's scope").optional(),
    efficiency: positive("Efficiency").max(1, "Efficiency is a fraction up to 1 (0.9 for 90 %)").optional(),
    inrush: z.strictObject({ currentA: positive("Inrush current").max(20_000), durationS: positive("Inrush time").max(60, "Inrush lasts at most 60 s; a longer one is the load's peak") }).optional(),
    lengthM: positive("Length").max(1000, "Length above 1000 m is not a vehicle cable run"),
    returnPath: z.enum(["two-wire", "chassis"]).default("two-wire"),
    returnResistanceOhm: z.number({ error: "Return resistance must be a number of ohms" }).finite().min(0, "Return resistance can't be negative").max(10, "Return resistance above 10 ohm is not a vehicle's frame").optional(),
    sourceResistanceOhm: positive("Source resistance").max(10).optional(),
    ampacityBasis: z.enum(["marine-table", "heat-balance"], { error: 'ampacityBasis is "marine-table" or "heat-balance"' }).default("marine-table"),
    device: z.enum(["fuse", "breaker", ...DEVICE_FAMILY_IDS] as [string, ...string[]], { error: `device is "fuse", "breaker" or one of ${DEVICE_FAMILY_IDS.join(", ")}` }).default("fuse"),
    circuitClass: z.enum(["critical", "non-critical"]).default("critical"),
    maxDropPercent: positive("Drop limit").max(50, "A drop limit is at most 50 %").optional(),
    maxDropV: positive("Drop limit").optional(),
    ambientC: z.number().finite().min(-60).max(200).optional(),
    zone: z.enum(["cabin", "engine", "underbody"]).optional(),
    insulationRatingC: z.number().finite().min(60, "insulation rated under 60 C is below the ampacity table").max(250).default(105),
    bundleSize: z.number().int("bundleSize is a whole number of conductors").min(1).max(200).default(1),
    material: z.enum(MATERIAL_IDS as [string, ...string[]], { error: `material must be one of ${MATERIAL_IDS.join(", ")}` }).default("copper"),
    family: z.enum(["awg", "metric"]).default("awg"),
    conductorTemp: z.union([z.enum(["operating", "ambient", "rated"]), z.number().finite().min(-60).max(250)]).default("operating"),
    duty: z
      .discriminatedUnion("kind", [
        z.strictObject({ kind: z.literal("continuous") }),
        z.strictObject({ kind: z.literal("intermittent"), onS: positive("On time"), periodS: positive("Period") }),
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
    if ((r.currentA === undefined) === (r.powerW === undefined)) {
      ctx.addIssue({ code: "custom", path: ["currentA"], message: "give the load's current (currentA) or its power (powerW), one of the two" });
    }
    if (r.efficiency !== undefined && r.powerW === undefined) {
      ctx.addIssue({ code: "custom", path: ["efficiency"], message: "efficiency goes with a power (powerW)" });
    }
    if (r.duty.kind === "intermittent" && r.duty.onS > r.duty.periodS) {
      ctx.addIssue({ code: "custom", path: ["duty", "onS"], message: "The on time can't be longer than the period" });
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
