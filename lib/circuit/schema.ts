import { z } from "zod";
import { SIZE_LABELS } from "@/lib/conductors/sizes";
import { MATERIAL_IDS } from "@/lib/conductors/materials";

/** The circuit document, version 1: one JSON document per circuit, SI units inside. */
export const CIRCUIT_SCHEMA_V1 = "ampwright.circuit/1";

const id = z
  .string()
  .min(1, "an id cannot be empty")
  .max(64, "ids are at most 64 characters")
  .regex(/^[A-Za-z0-9_-]+$/, "ids use letters, digits, _ and - only (no dots or spaces)");
const volts = (what: string) => z.number({ error: `${what} must be a number of volts` }).finite();
const nonNegOhm = (what: string) => z.number({ error: `${what} must be a number of ohms` }).finite().min(0, `${what} can't be negative`);
const amps = (what: string) => z.number({ error: `${what} must be a number of amperes` }).finite();

const base = {
  id,
  label: z.string().max(200).optional(),
  position: z.strictObject({ x: z.number().finite(), y: z.number().finite() }).optional(),
};

export const batterySchema = z.strictObject({
  ...base,
  kind: z.literal("battery"),
  openCircuitVoltage: volts("Open-circuit voltage").min(0, "Open-circuit voltage can't be negative").max(1000, "Open-circuit voltage is at most 1000 V"),
  internalResistance: nonNegOhm("Internal resistance"),
  capacityAh: z.number({ error: "Capacity must be a number of ampere-hours" }).finite().positive("Capacity must be more than 0 Ah").optional(),
  cca: z.number({ error: "CCA must be a number of amperes" }).finite().positive("CCA must be more than 0 A").optional(),
  /** How much faster it runs down at higher currents (Peukert's law); PEUKERT_DEFAULT when not given. */
  peukertExponent: z.number({ error: "Peukert exponent must be a number" }).finite().min(1, "Peukert exponent is at least 1").max(1.6, "Peukert exponent is at most 1.6").optional(),
});
export const alternatorSchema = z.strictObject({
  ...base,
  kind: z.literal("alternator"),
  regulatedVoltage: volts("Regulated voltage").positive("Regulated voltage must be more than 0 V").max(1000, "Regulated voltage is at most 1000 V"),
  ratedCurrent: amps("Rated current").min(0, "Rated current can't be negative"),
  /** Its output at engine idle as a fraction of its rating; IDLE_FRACTION_DEFAULT when not given. */
  idleFraction: z.number({ error: "Output at idle must be a fraction such as 0.6" }).finite().gt(0, "Output at idle must be more than 0").max(1, "Output at idle is at most its rating (1)").optional(),
  enabled: z.boolean().optional(),
});
export const starterSchema = z
  .strictObject({
    ...base,
    kind: z.literal("starter"),
    current: amps("Current").min(0, "Current can't be negative").optional(),
    resistance: z.number().finite().positive("resistance must be more than 0 ohm").optional(),
    enabled: z.boolean().optional(),
  })
  .refine((s) => (s.current === undefined) !== (s.resistance === undefined), {
    message: "a starter takes either current (A) or resistance (ohm), not both and not neither",
    path: ["current"],
  });
export const loadSchema = z
  .strictObject({
    ...base,
    kind: z.literal("load"),
    mode: z.enum(["current", "power", "resistance"]),
    value: z.number({ error: "The load's value must be a number" }).finite().min(0, "The load's value can't be negative"),
    enabled: z.boolean().optional(),
  })
  .refine((l) => l.mode !== "resistance" || l.value > 0, { message: "a resistance load needs a value above 0 ohm", path: ["value"] });
export const fuseSchema = z.strictObject({ ...base, kind: z.literal("fuse"), rating: amps("Rating").positive("Rating must be more than 0 A"), resistance: nonNegOhm("Resistance") });
export const switchSchema = z.strictObject({
  ...base,
  kind: z.literal("switch"),
  closed: z.boolean().optional(),
  contactResistance: nonNegOhm("contactResistance"),
});
export const jointSchema = z.strictObject({ ...base, kind: z.literal("joint"), resistance: nonNegOhm("resistance") });
export const junctionSchema = z.strictObject({ ...base, kind: z.literal("junction") });
export const groundSchema = z.strictObject({ ...base, kind: z.literal("ground"), reference: z.boolean().optional() });

export const componentSchema = z.discriminatedUnion("kind", [
  batterySchema,
  alternatorSchema,
  starterSchema,
  loadSchema,
  fuseSchema,
  switchSchema,
  jointSchema,
  junctionSchema,
  groundSchema,
]);

export const COMPONENT_KINDS = ["battery", "alternator", "starter", "load", "fuse", "switch", "joint", "junction", "ground"] as const;
export type ComponentKind = (typeof COMPONENT_KINDS)[number];

/** Terminals of each kind, first terminal first. */
export const TERMINALS: Record<ComponentKind, readonly string[]> = {
  battery: ["pos", "neg"],
  alternator: ["out", "case"],
  starter: ["in", "case"],
  load: ["pos", "neg"],
  fuse: ["a", "b"],
  switch: ["a", "b"],
  joint: ["a", "b"],
  junction: ["t"],
  ground: ["t"],
};

const terminalRef = z.string().regex(/^[A-Za-z0-9_-]+\.[a-z]+$/, 'a terminal is written "<component id>.<terminal>", like "B1.pos"');

export const wireSchema = z
  .strictObject({
    id,
    from: terminalRef,
    to: terminalRef,
    label: z.string().max(200).optional(),
    size: z.enum(SIZE_LABELS as [string, ...string[]], { error: 'size must be one of "20 AWG" ... "4/0 AWG" or "0.5 mm2" ... "120 mm2"' }).optional(),
    material: z.enum(MATERIAL_IDS as [string, ...string[]]).optional(),
    lengthM: z.number({ error: "Length must be a number of metres" }).finite().min(0, "Length can't be negative").max(1000, "Length is at most 1000 m").optional(),
    resistanceOhm: nonNegOhm("Resistance").optional(),
    insulationRatingC: z.number({ error: "Insulation rating must be a number of degrees C" }).finite().min(60, "Insulation rating is at least 60 C").max(250, "Insulation rating is at most 250 C").optional(),
    bundleSize: z.number({ error: "Bundle must be a whole number of cables" }).int("Bundle must be a whole number of cables").min(1, "Bundle is at least 1 cable").max(200, "Bundle is at most 200 cables").optional(),
    zone: z.enum(["cabin", "engine", "underbody"]).optional(),
  })
  .refine((w) => w.resistanceOhm !== undefined || (w.size !== undefined && w.lengthM !== undefined), {
    message: "A cable needs a size and a length (or a resistance of its own, for a strap, frame rail or engine block)",
    path: ["size"],
  });

export const stateSchema = z.strictObject({
  id,
  name: z.string().min(1).max(120),
  set: z.record(id, z.record(z.string(), z.union([z.number().finite(), z.boolean(), z.string()]))).default({}),
});

export const circuitSchemaV1 = z.strictObject({
  schema: z.literal(CIRCUIT_SCHEMA_V1),
  name: z.string().min(1, "give the circuit a name").max(200),
  systemVoltage: z.number().finite().positive().max(1000),
  ambientC: z.number({ error: "Ambient must be a number of degrees C" }).finite().min(-60, "Ambient is at least -60 C").max(150, "Ambient is at most 150 C").optional(),
  conductorTemp: z.union([z.enum(["ambient", "rated"]), z.number().finite().min(-60).max(250)]).optional(),
  components: z.array(componentSchema),
  wires: z.array(wireSchema),
  states: z.array(stateSchema).optional(),
});

export type CircuitDocument = z.infer<typeof circuitSchemaV1>;
export type Component = z.infer<typeof componentSchema>;
export type Wire = z.infer<typeof wireSchema>;
export type OperatingState = z.infer<typeof stateSchema>;

/** Defaults the document leaves out. */
export const CIRCUIT_DEFAULTS = {
  ambientC: 25,
  conductorTemp: "ambient" as const,
  insulationRatingC: 105,
  bundleSize: 1,
  material: "copper" as const,
  enabled: true,
  closed: true,
};
