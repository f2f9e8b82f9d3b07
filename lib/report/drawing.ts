import { TERMINALS, type CircuitDocument, type ComponentKind } from "@/lib/circuit";

/** Part boxes as the workspace draws them (width 132, or 96 for one-terminal parts), so a report looks like the canvas. */
export const PART_W = 132;
export const PART_W_ONE = 96;
export const PART_H = 64;
const MARGIN = 40;

export type DrawnPart = { id: string; kind: ComponentKind; label: string; x: number; y: number; w: number; h: number; off: boolean };
export type DrawnCable = { id: string; label: string; points: [number, number][]; mid: [number, number]; kind: "cable" | "link" };
export type Drawing = { width: number; height: number; parts: DrawnPart[]; cables: DrawnCable[] };

const KIND_WORD: Record<ComponentKind, string> = {
  battery: "Battery",
  alternator: "Alternator",
  starter: "Starter",
  load: "Load",
  fuse: "Fuse",
  switch: "Switch",
  joint: "Connection",
  junction: "Junction",
  ground: "Ground",
};

export function kindWord(kind: ComponentKind): string {
  return KIND_WORD[kind];
}

/**
 * A circuit laid out for print: each part a box where it sits on the canvas (parts never placed go in a row below),
 * each cable an elbowed line between terminals, all shifted so the drawing starts at the margin.
 */
export function drawCircuit(doc: CircuitDocument, stateId = "base"): Drawing {
  const overrides = doc.states?.find((s) => s.id === stateId)?.set ?? {};
  const placed = doc.components.map((c, i) => {
    const one = TERMINALS[c.kind].length === 1;
    const pos = c.position ?? { x: (i % 6) * 180, y: 1000 + Math.floor(i / 6) * 120 };
    const merged = { ...c, ...(overrides[c.id] ?? {}) } as typeof c & { enabled?: boolean; closed?: boolean };
    return { id: c.id, kind: c.kind, label: c.label ?? KIND_WORD[c.kind], x: pos.x, y: pos.y, w: one ? PART_W_ONE : PART_W, h: PART_H, off: merged.enabled === false || merged.closed === false };
  });
  const minX = Math.min(0, ...placed.map((p) => p.x));
  const minY = Math.min(0, ...placed.map((p) => p.y));
  const parts = placed.map((p) => ({ ...p, x: p.x - minX + MARGIN, y: p.y - minY + MARGIN }));
  const byId = new Map(parts.map((p) => [p.id, p]));

  const terminalAt = (ref: string): [number, number] | undefined => {
    const [id, t] = ref.split(".");
    const p = byId.get(id);
    if (!p) return undefined;
    const terms = TERMINALS[p.kind];
    if (terms.length === 1) return [p.x + p.w / 2, p.y];
    return t === terms[0] ? [p.x, p.y + p.h / 2] : [p.x + p.w, p.y + p.h / 2];
  };

  const cables: DrawnCable[] = [];
  for (const w of doc.wires) {
    const a = terminalAt(w.from);
    const b = terminalAt(w.to);
    if (!a || !b) continue;
    const midX = (a[0] + b[0]) / 2;
    const points: [number, number][] = a[1] === b[1] ? [a, b] : [a, [midX, a[1]], [midX, b[1]], b];
    const label = w.resistanceOhm !== undefined ? w.id : `${w.id} ${w.size}`;
    cables.push({ id: w.id, label, points, mid: [midX, (a[1] + b[1]) / 2], kind: w.resistanceOhm !== undefined ? "link" : "cable" });
  }
  const width = Math.max(200, ...parts.map((p) => p.x + p.w + MARGIN));
  const height = Math.max(120, ...parts.map((p) => p.y + p.h + MARGIN));
  return { width, height, parts, cables };
}
