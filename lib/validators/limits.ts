import { z } from "zod";
import { typedNumber } from "@/lib/units/number";
import { LIMIT_FIELDS } from "@/lib/diagnosis/limits";

const field = (f: (typeof LIMIT_FIELDS)[number]) =>
  z
    .number({ error: `${f.label} must be a number of ${f.unit === "%" ? "percent" : "volts"}` })
    .finite()
    .min(f.min, `${f.label}: at least ${f.min} ${f.unit}`)
    .max(f.max, `${f.label}: at most ${f.max} ${f.unit}`);

/**
 * An organisation's own diagnosis limits: any of the fields, each within its range; a field left out goes back to
 * the common-practice default. The charging window's low end must sit under its high end.
 */
export const diagnosisLimitsInput = z
  .strictObject({
    limits: z.strictObject(Object.fromEntries(LIMIT_FIELDS.map((f) => [f.key, typedNumber(field(f).optional())])) as unknown as { [K in (typeof LIMIT_FIELDS)[number]["key"]]: z.ZodOptional<z.ZodType<number, unknown>> }),
  })
  .refine((v) => (v.limits.chargingLowV ?? 13.5) < (v.limits.chargingHighV ?? 14.8), {
    message: "the charging window's low end must be below its high end",
    path: ["limits", "chargingLowV"],
  });
export type DiagnosisLimitsInput = z.input<typeof diagnosisLimitsInput>;
