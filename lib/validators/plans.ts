import { z } from "zod";
import { planSchema } from "@/lib/diagnosis/plans";

/** A test plan an organisation adds: the same data as the built-in plans. */
export const addPlanInput = z.strictObject({ plan: planSchema });
export type AddPlanInput = z.input<typeof addPlanInput>;
