import { z } from "zod";
import { typedNumber } from "@/lib/units/number";
import { SIZE_LABELS } from "@/lib/conductors/sizes";
import { CIRCUIT_SCHEMA_V1, type CircuitDocument } from "./schema";

/** The start page's cranking check: one battery, a positive and a ground cable, a joint on each, a starter. */
export const quickCheckInput = z.object({
  restingVolts: typedNumber(z.number({ error: "resting voltage must be a number of volts" }).min(10, "a 12 V battery below 10 V at rest is flat: charge it first").max(13.5, "above 13.5 V the battery is not at rest (surface charge): turn on the headlamps for a minute, then measure")),
  internalMilliohm: typedNumber(z.number({ error: "internal resistance must be a number" }).min(1, "at least 1 mOhm").max(100, "at most 100 mOhm")),
  positiveSize: z.enum(SIZE_LABELS as [string, ...string[]], { error: "choose a cable size" }),
  positiveLengthM: typedNumber(z.number({ error: "length must be a number of metres" }).positive("length must be more than 0").max(20, "at most 20 m")),
  positiveJointMilliohm: typedNumber(z.number({ error: "joint resistance must be a number" }).min(0, "cannot be negative").max(1000, "at most 1000 mOhm")),
  groundSize: z.enum(SIZE_LABELS as [string, ...string[]], { error: "choose a cable size" }),
  groundLengthM: typedNumber(z.number({ error: "length must be a number of metres" }).positive("length must be more than 0").max(20, "at most 20 m")),
  groundJointMilliohm: typedNumber(z.number({ error: "joint resistance must be a number" }).min(0, "cannot be negative").max(1000, "at most 1000 mOhm")),
  starterAmps: typedNumber(z.number({ error: "starter current must be a number of amperes" }).positive("starter current must be more than 0").max(2000, "at most 2000 A")),
});
export type QuickCheckInput = z.output<typeof quickCheckInput>;

export const quickCheckDefaults: QuickCheckInput = {
  restingVolts: 12.6,
  internalMilliohm: 6,
  positiveSize: "2/0 AWG",
  positiveLengthM: 1.5,
  positiveJointMilliohm: 0.2,
  groundSize: "2/0 AWG",
  groundLengthM: 0.8,
  groundJointMilliohm: 1.5,
  starterAmps: 180,
};

/** Common practice (no single standard) for a starting circuit while cranking. */
export const CRANKING_LIMITS_V = { positive: 0.5, ground: 0.2, joint: 0.1 };

export function quickCheckCircuit(i: QuickCheckInput): CircuitDocument {
  return {
    schema: CIRCUIT_SCHEMA_V1,
    name: "Cranking check",
    systemVoltage: 12,
    ambientC: 25,
    components: [
      { id: "B1", kind: "battery", label: "Battery", openCircuitVoltage: i.restingVolts, internalResistance: i.internalMilliohm / 1000 },
      { id: "JP", kind: "joint", label: "Positive clamp", resistance: i.positiveJointMilliohm / 1000 },
      { id: "M1", kind: "starter", label: "Starter", current: i.starterAmps },
      { id: "JG", kind: "joint", label: "Ground bolt", resistance: i.groundJointMilliohm / 1000 },
    ],
    wires: [
      { id: "WP0", from: "B1.pos", to: "JP.a", resistanceOhm: 0 },
      { id: "WP", label: "Positive cable", from: "JP.b", to: "M1.in", size: i.positiveSize, lengthM: i.positiveLengthM },
      { id: "WG", label: "Ground cable", from: "M1.case", to: "JG.a", size: i.groundSize, lengthM: i.groundLengthM },
      { id: "WG0", from: "JG.b", to: "B1.neg", resistanceOhm: 0 },
    ],
  };
}
