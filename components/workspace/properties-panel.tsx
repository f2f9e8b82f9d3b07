"use client";

import { useEffect, useMemo } from "react";
import { useForm } from "react-hook-form";
import { CIRCUIT_DEFAULTS, componentSchema, wireSchema, type Component, type ComponentKind, type Wire } from "@/lib/circuit";
import { MATERIALS, MATERIAL_IDS } from "@/lib/conductors/materials";
import { SIZE_LABELS } from "@/lib/conductors/sizes";
import { ratingShown, sizeShown, type UnitPrefs } from "@/lib/workspace/prefs";
import { fromSI, parseDecimal, parseQuantity, type Quantity } from "@/lib/units";
import { KIND_NAMES } from "@/lib/workspace/edit";


type Field =
  | { key: string; label: string; type: "text" }
  | { key: string; label: string; type: "quantity"; quantity: Quantity; unit: string; optional?: boolean }
  | { key: string; label: string; type: "count"; optional?: boolean }
  | { key: string; label: string; type: "bool" }
  | { key: string; label: string; type: "select"; options: [string, string][] };

const LOAD_UNIT = { current: ["current", "A"], power: ["power", "W"], resistance: ["resistance", "ohm"] } as const;

function componentFields(c: Component): Field[] {
  const label: Field = { key: "label", label: "Name on the sketch", type: "text" };
  const by: Record<ComponentKind, Field[]> = {
    battery: [
      { key: "openCircuitVoltage", label: "Open-circuit voltage", type: "quantity", quantity: "voltage", unit: "V" },
      { key: "internalResistance", label: "Internal resistance", type: "quantity", quantity: "resistance", unit: "mOhm" },
      { key: "cca", label: "Cold-cranking amps (CCA)", type: "count", optional: true },
      { key: "capacityAh", label: "Capacity, Ah", type: "count", optional: true },
      { key: "peukertExponent", label: "Peukert exponent (empty: 1.25)", type: "count", optional: true },
    ],
    alternator: [
      { key: "regulatedVoltage", label: "Regulated voltage", type: "quantity", quantity: "voltage", unit: "V" },
      { key: "ratedCurrent", label: "Rated output", type: "quantity", quantity: "current", unit: "A" },
      { key: "idleFraction", label: "Output at idle, share of rated (empty: 0.6)", type: "count", optional: true },
      { key: "enabled", label: "Running (charging)", type: "bool" },
    ],
    starter: [
      c.kind === "starter" && c.resistance !== undefined
        ? { key: "resistance", label: "Winding resistance", type: "quantity", quantity: "resistance", unit: "mOhm" }
        : { key: "current", label: "Cranking draw", type: "quantity", quantity: "current", unit: "A" },
      { key: "enabled", label: "Cranking", type: "bool" },
    ],
    load: [
      { key: "mode", label: "It draws", type: "select", options: [["current", "a set current"], ["power", "a set power"], ["resistance", "as a resistance"]] },
      c.kind === "load"
        ? { key: "value", label: c.mode === "current" ? "Current" : c.mode === "power" ? "Power" : "Resistance", type: "quantity", quantity: LOAD_UNIT[c.mode][0], unit: LOAD_UNIT[c.mode][1] }
        : label,
      { key: "enabled", label: "Switched on", type: "bool" },
    ],
    fuse: [
      { key: "rating", label: "Rating", type: "quantity", quantity: "current", unit: "A" },
      { key: "resistance", label: "Resistance", type: "quantity", quantity: "resistance", unit: "mOhm" },
    ],
    switch: [
      { key: "closed", label: "Closed", type: "bool" },
      { key: "contactResistance", label: "Contact resistance", type: "quantity", quantity: "resistance", unit: "mOhm" },
    ],
    joint: [{ key: "resistance", label: "Resistance of the connection", type: "quantity", quantity: "resistance", unit: "mOhm" }],
    junction: [],
    ground: [{ key: "reference", label: "0 V reference (where the black lead sits)", type: "bool" }],
  };
  return [label, ...by[c.kind]];
}

const RATINGS = [60, 75, 80, 90, 105, 125, 150, 200];

function wireFields(w: Wire, prefs: UnitPrefs): Field[] {
  const fixed = w.resistanceOhm !== undefined;
  return [
    { key: "label", label: "Name on the sketch", type: "text" },
    { key: "fixed", label: "Fixed resistance (strap, frame rail, engine block)", type: "bool" },
    ...(fixed
      ? ([{ key: "resistanceOhm", label: "Resistance", type: "quantity", quantity: "resistance", unit: "mOhm" }] as Field[])
      : ([
          { key: "size", label: "Size", type: "select", options: SIZE_LABELS.map((s) => [s, sizeShown(s, prefs, true)]) },
          { key: "material", label: "Material", type: "select", options: MATERIAL_IDS.map((m) => [m, MATERIALS[m].name]) },
          { key: "lengthM", label: "Length (one way)", type: "quantity", quantity: "length", unit: prefs.length },
          { key: "insulationRatingC", label: "Insulation rating", type: "select", options: RATINGS.map((r) => [String(r), ratingShown(r, prefs)]) },
          { key: "bundleSize", label: "Conductors in the bundle", type: "count" },
          { key: "zone", label: "Where it runs", type: "select", options: [["cabin", "Cabin"], ["engine", "Engine compartment"], ["underbody", "Underbody"]] },
        ] as Field[])),
  ];
}

/** Fields a cable may leave out, shown as the document's defaults (a cable drawn on the canvas has none of them). */
const WIRE_DEFAULTS: Record<string, string | number> = { insulationRatingC: CIRCUIT_DEFAULTS.insulationRatingC, bundleSize: CIRCUIT_DEFAULTS.bundleSize, material: CIRCUIT_DEFAULTS.material, zone: "cabin" };

function show(value: unknown, f: Field): string | boolean {
  // Unset switches read as the document's defaults: enabled and closed are on, the reference mark is off.
  if (f.type === "bool") return value === undefined ? !(f.key === "reference" || f.key === "fixed") : Boolean(value);
  if ((value === undefined || value === null) && f.key in WIRE_DEFAULTS) return String(WIRE_DEFAULTS[f.key]);
  if (value === undefined || value === null) return "";
  if (f.type === "quantity") return `${+fromSI(Number(value), f.quantity, f.unit).toPrecision(6)} ${f.unit === "ohm" ? "Ω" : f.unit === "mOhm" ? "mΩ" : f.unit}`;
  return String(value);
}

/**
 * The chosen part's or cable's settings. Values take any unit ("15 ft", "8 mOhm", "450 A"); a change is applied when
 * the field is left (or Enter), checked by the circuit document's own schema, and re-solved at once.
 */
export function PropertiesPanel(props: {
  item: { kind: "component"; value: Component; base: Component } | { kind: "wire"; value: Wire };
  prefs: UnitPrefs;
  stateName?: string;
  readOnly?: boolean;
  onApply: (next: Component | Wire) => void;
  onDelete: () => void;
}) {
  const { item, prefs } = props;
  // The form follows the item's content, not its identity: the editor re-renders often (solves, saves) and a
  // reset on each would throw away what is being typed.
  const content = JSON.stringify(item.value);
  const fields = useMemo(() => (item.kind === "component" ? componentFields(item.value) : wireFields(item.value, prefs)), [content, prefs]); // eslint-disable-line react-hooks/exhaustive-deps
  const values = useMemo(() => {
    const src = item.value as Record<string, unknown>;
    return Object.fromEntries(fields.map((f) => [f.key, f.key === "fixed" ? src.resistanceOhm !== undefined : show(src[f.key], f)]));
  }, [content, fields]); // eslint-disable-line react-hooks/exhaustive-deps
  const form = useForm<Record<string, string | boolean>>({ defaultValues: values });
  useEffect(() => form.reset(values), [form, values]);

  const apply = form.handleSubmit((v) => {
    const next: Record<string, unknown> = { ...(item.value as Record<string, unknown>) };
    let bad = false;
    for (const f of fields) {
      const raw = v[f.key];
      if (f.type === "text") {
        const t = String(raw ?? "").trim();
        if (t) next[f.key] = t;
        else delete next[f.key];
      } else if (f.type === "bool") {
        if (f.key === "fixed") {
          if (raw && next.resistanceOhm === undefined) next.resistanceOhm = 0.001;
          if (!raw && next.resistanceOhm !== undefined) {
            delete next.resistanceOhm;
            next.size ??= "10 AWG";
            next.lengthM ??= 1;
          }
        } else next[f.key] = Boolean(raw);
      } else if (f.type === "select") {
        next[f.key] = f.key === "insulationRatingC" ? Number(raw) : raw;
        if (f.key === "mode" && raw !== (item.value as Record<string, unknown>).mode) next.value = raw === "resistance" ? 1 : 10;
      } else if (f.type === "count") {
        const t = String(raw ?? "").trim();
        if (!t && f.optional) delete next[f.key];
        else {
          const n = parseDecimal(t);
          if (!n.ok || n.value < 0) {
            form.setError(f.key, { message: n.ok ? "can't be negative" : n.message });
            bad = true;
          } else next[f.key] = n.value;
        }
      } else {
        const t = String(raw ?? "").trim();
        if (!t && f.optional) delete next[f.key];
        else {
          const q = parseQuantity(t, f.quantity, f.unit);
          if (!q.ok) {
            form.setError(f.key, { message: q.message });
            bad = true;
          } else next[f.key] = q.value;
        }
      }
    }
    if (bad) return;
    const checked = item.kind === "component" ? componentSchema.safeParse(next) : wireSchema.safeParse(next);
    if (!checked.success) {
      for (const i of checked.error.issues) form.setError(String(i.path[0] ?? "label"), { message: i.message });
      return;
    }
    if (JSON.stringify(checked.data) !== JSON.stringify(item.value)) props.onApply(checked.data);
  });

  const id = item.value.id;
  const title = item.kind === "component" ? `${id}: ${KIND_NAMES[item.value.kind]}` : `${id}: cable ${item.value.from} → ${item.value.to}`;
  return (
    <form
      onSubmit={(e) => {
        e.preventDefault();
        void apply();
      }}
      className="space-y-3"
      aria-label={`Settings of ${id}`}
      data-testid="properties"
    >
      <h2 className="font-semibold">{title}</h2>
      {props.stateName ? (
        <p className="rounded bg-caution-soft px-2 py-1 text-xs" data-testid="state-edit-note">
          Changes here apply to the state &ldquo;{props.stateName}&rdquo; only.
        </p>
      ) : null}
      {fields.map((f) => {
        const err = form.formState.errors[f.key]?.message;
        const fid = `prop-${id}-${f.key}`;
        const reg = form.register(f.key, { onBlur: () => void apply() });
        if (f.type === "bool") {
          return (
            <label key={f.key} className="flex items-center gap-2 text-sm">
              <input type="checkbox" {...form.register(f.key, { onChange: () => void apply() })} disabled={props.readOnly} data-testid={`prop-${f.key}`} />
              {f.label}
            </label>
          );
        }
        return (
          <div key={f.key}>
            <label htmlFor={fid} className="block text-xs font-medium text-graphite-700">
              {f.label}
            </label>
            {f.type === "select" ? (
              <select id={fid} {...form.register(f.key, { onChange: () => void apply() })} disabled={props.readOnly} className="mt-0.5 w-full rounded border border-graphite-300 bg-white px-2 py-1.5 text-sm" data-testid={`prop-${f.key}`}>
                {f.options.map(([v, l]) => (
                  <option key={v} value={v}>
                    {l}
                  </option>
                ))}
              </select>
            ) : (
              <input
                id={fid}
                {...reg}
                readOnly={props.readOnly}
                inputMode={f.type === "text" ? "text" : "decimal"}
                aria-invalid={err ? true : undefined}
                className="mt-0.5 w-full rounded border border-graphite-300 bg-white px-2 py-1.5 text-sm"
                data-testid={`prop-${f.key}`}
              />
            )}
            {err ? (
              <p className="mt-0.5 text-xs text-over" role="alert">
                {String(err)}
              </p>
            ) : null}
          </div>
        );
      })}
      {item.kind === "wire" ? <p className="text-xs text-graphite-500">Type a length in m or ft and a resistance in Ω or mΩ; the value is stored in SI.</p> : null}
      {/* Enter in any field applies it (a form with several fields needs a submit button for that). */}
      <button type="submit" className="sr-only" tabIndex={-1}>
        Apply
      </button>
      {!props.readOnly && !props.stateName ? (
        <button type="button" onClick={props.onDelete} className="text-sm font-medium text-over underline-offset-2 hover:underline" data-testid="prop-delete">
          Remove {id}
        </button>
      ) : null}
    </form>
  );
}
