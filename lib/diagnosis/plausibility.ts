import { stateIdsOf, type CircuitDocument } from "@/lib/circuit";

/**
 * The most any two points of a vehicle system can differ by: its charging voltage at the top of the window, about
 * 15 V on a 12 V system (common practice), with a margin for the meter: 1.35 x the nominal voltage.
 */
export const MOST_VOLTS_FACTOR = 1.35;
/** Passive parts (cables, joints, fuses, switches) only: what a reading across one or a run of them can show at most. */
const PASSIVE_KINDS = new Set(["joint", "fuse", "switch", "junction", "ground"]);

export type ReadingInput = { positive: string; negative: string; stateId: string; value: number; unit: "V" | "mV" };
export type Implausible = { path: string; message: string; likely: "mV typed as V" | "leads swapped" | "not at rest" | "impossible" };

const volts = (v: number) => `${+v.toPrecision(4)} V`;

/**
 * Why a reading cannot be what the meter showed on this circuit, in words with the likely slip; empty when it can.
 * Refused: more than the whole system can show anywhere (often millivolts typed as volts), a negative or impossibly
 * high voltage across a battery's own posts, and more than the system's voltage across cables and connections alone.
 */
export function implausibleReading(doc: CircuitDocument, r: ReadingInput): Implausible[] {
  const v = r.unit === "mV" ? r.value / 1000 : r.value;
  const most = MOST_VOLTS_FACTOR * doc.systemVoltage;
  const asMilli = r.unit === "V" && Math.abs(v) >= 1 && Math.abs(v) / 1000 <= most;
  const out: Implausible[] = [];
  if (Math.abs(v) > most) {
    out.push({
      path: "value",
      likely: asMilli ? "mV typed as V" : "impossible",
      message: `${volts(v)} is more than a ${doc.systemVoltage} V system can show anywhere (at most about ${most.toFixed(0)} V).${asMilli ? ` Was it ${r.value} mV? Record it with the unit mV.` : " Check the meter's range and the number typed."}`,
    });
    return out;
  }
  const [pid, pt] = r.positive.split(".");
  const [nid, nt] = r.negative.split(".");
  const battery = pid === nid ? doc.components.find((c) => c.id === pid && c.kind === "battery") : undefined;
  if (battery && pt === "neg" && nt === "pos" && v > 0) {
    // Red on the negative post, black on the positive: fine, the meter reads negative; a positive figure is a slip.
    out.push({ path: "value", likely: "leads swapped", message: `With the red lead on ${r.positive} (−) and the black on ${r.negative} (+) the meter reads a negative voltage; ${volts(v)} means the leads were the other way round. Swap the probe points, or the sign.` });
  }
  if (battery && pt === "pos" && nt === "neg") {
    if (v < 0) {
      out.push({ path: "value", likely: "leads swapped", message: `A battery's + post is never below its − post: ${volts(v)} means the leads were swapped. Record it as ${volts(-v)} with the red lead on ${r.positive}.` });
    }
    const resting = r.stateId === "base" || !stateIdsOf(doc).includes(r.stateId);
    if (resting && v > 1.125 * doc.systemVoltage) {
      out.push({ path: "value", likely: "not at rest", message: `${volts(v)} across a ${doc.systemVoltage} V battery at rest is too high for a battery alone (a full one reads about ${(12.7 * doc.systemVoltage / 12).toFixed(1)} V): it was charging or carrying surface charge. Take it in a charging state, or rest the battery and read again.` });
    }
  }
  // Across cables and connections alone: never more than the sources behind them.
  const passiveOnly = [pid, nid].every((id) => {
    const c = doc.components.find((x) => x.id === id);
    return c !== undefined && PASSIVE_KINDS.has(c.kind);
  });
  if (passiveOnly && Math.abs(v) > doc.systemVoltage) {
    out.push({
      path: "value",
      likely: asMilli ? "mV typed as V" : "impossible",
      message: `${volts(v)} between ${r.positive} and ${r.negative}, where only cables and connections lie, is more than the ${doc.systemVoltage} V the system has.${asMilli ? ` Was it ${r.value} mV?` : ""}`,
    });
  }
  return out;
}
