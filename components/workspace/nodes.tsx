"use client";

import { Handle, Position, type Node, type NodeProps, type NodeTypes } from "@xyflow/react";
import { TERMINALS, type Component, type ComponentKind } from "@/lib/circuit";
import type { Band } from "@/lib/workspace/analysis";
import { memo } from "react";
import { FAR_HIDDEN, ON_SCREEN_ONLY, usePartFigures, usePartView } from "./canvas-view";
import { Symbol } from "./symbols";

/** What a part's node draws besides its figures: the part itself and, when solved, its state. */
export type PartData = {
  component: Component;
  /** A joint's drop band, or a part that is off. */
  band?: Band;
  off?: boolean;
  note?: string;
};
/** A part's figures: volts at each terminal (by terminal name) relative to the reference, once solved. */
export type PartFigures = { volts?: Record<string, number> };
/** The canvas's node: only its kind and place; what it shows comes from the canvas view store (canvas-view.tsx). */
export type PartNode = Node<Record<string, never>, ComponentKind>;

const ROLE: Record<string, string> = { pos: "+", neg: "−", out: "B+", case: "case", in: "in", a: "a", b: "b", t: "" };

const bandRing: Record<Band, string> = {
  within: "border-graphite-300",
  caution: "border-caution ring-2 ring-caution/40",
  over: "border-over ring-2 ring-over/50 border-dashed",
};

function volts(v: number | undefined) {
  return v === undefined ? null : `${v.toFixed(Math.abs(v) < 10 ? 3 : 2)} V`;
}

/** Whether two parts draw the same apart from their figures. */
export function samePartView(a: PartData, b: PartData): boolean {
  return a.component === b.component && a.band === b.band && a.off === b.off && a.note === b.note;
}

/** Whether two parts' figures draw the same: the volts to the digits on screen. */
export function samePartFigures(a: PartFigures, b: PartFigures): boolean {
  if (!a.volts || !b.volts) return !a.volts === !b.volts;
  const keys = Object.keys(b.volts);
  return keys.length === Object.keys(a.volts).length && keys.every((k) => volts(a.volts![k]) === volts(b.volts![k]));
}

/**
 * A part on the canvas. Its drawing and its figures come from two view stores: a re-solve usually changes only the
 * figures, and then only the small figures row is drawn again, not the part with its symbol and terminals.
 */
function PartView({ id, selected, type }: NodeProps<PartNode>) {
  const data = usePartView(id);
  if (!data) return null;
  return <PartDrawing data={data} selected={selected} type={type} />;
}

/** The figures row's size while it is skipped off screen. */
const FIGURES_SIZE = { containIntrinsicSize: "auto 100px auto 15px" };

/** A part's terminal voltages, in terminal order. */
function PartVolts({ id, kind }: { id: string; kind: ComponentKind }) {
  const v = usePartFigures(id)?.volts;
  if (!v) return null;
  const [first, second] = TERMINALS[kind];
  if (second === undefined) {
    return v[first] !== undefined ? (
      <div className={`mt-0.5 font-mono text-[10px] text-copper-700 ${FAR_HIDDEN} ${ON_SCREEN_ONLY}`} style={FIGURES_SIZE}>
        {volts(v[first])}
      </div>
    ) : null;
  }
  return (
    <div className={`mt-0.5 flex justify-between font-mono text-[10px] text-copper-700 ${FAR_HIDDEN} ${ON_SCREEN_ONLY}`} style={FIGURES_SIZE}>
      <span>{volts(v[first])}</span>
      <span>{volts(v[second])}</span>
    </div>
  );
}

const PartDrawing = memo(function PartDrawing({ data, selected, type }: { data: PartData; selected: boolean; type: string }) {
  const c = data.component;
  const kind = type as ComponentKind;
  const oneTerminal = kind === "junction" || kind === "ground";
  const [first, second] = TERMINALS[kind];
  const ring = data.band ? bandRing[data.band] : "border-graphite-300";
  return (
    <div
      className={`relative rounded-md border bg-white px-2 pb-1 pt-1 text-center shadow-sm ${ring} ${selected ? "outline outline-2 outline-offset-2 outline-copper-500" : ""} ${data.off ? "opacity-60" : ""}`}
      style={{ width: oneTerminal ? 96 : 132 }}
      data-testid={`part-${c.id}`}
      title={data.note}
    >
      <div className="flex items-baseline justify-between gap-1 text-[10px] leading-3 text-graphite-500">
        <span className="font-mono font-semibold text-graphite-800">{c.id}</span>
        {data.off ? <span>off</span> : data.band === "over" ? <span className="font-semibold text-over">over</span> : null}
      </div>
      <Symbol kind={kind} className={`mx-auto h-9 w-14 ${data.band === "over" ? "text-over" : data.band === "caution" ? "text-caution" : "text-graphite-900"}`} />
      <div className="truncate text-[11px] leading-tight text-graphite-800">{c.label ?? kindWord[kind]}</div>
      {oneTerminal ? (
        <>
          <Handle id="t" type="source" position={Position.Top} className="!h-3 !w-3 !border-2 !border-white !bg-copper-600" aria-label={`${c.id} terminal`} />
          <PartVolts id={c.id} kind={kind} />
        </>
      ) : (
        <>
          <Handle id={first} type="source" position={Position.Left} className="!h-3 !w-3 !border-2 !border-white !bg-copper-600" aria-label={`${c.id} ${first}`} />
          <Handle id={second} type="source" position={Position.Right} className="!h-3 !w-3 !border-2 !border-white !bg-graphite-700" aria-label={`${c.id} ${second}`} />
          <span className="absolute -left-1 top-1/2 -translate-x-full -translate-y-5 text-[10px] font-semibold text-graphite-700">{ROLE[first]}</span>
          <span className="absolute -right-1 top-1/2 -translate-y-5 translate-x-full text-[10px] font-semibold text-graphite-700">{ROLE[second]}</span>
          <PartVolts id={c.id} kind={kind} />
        </>
      )}
    </div>
  );
});

const kindWord: Record<ComponentKind, string> = {
  battery: "Battery",
  alternator: "Alternator",
  starter: "Starter",
  load: "Load",
  fuse: "Fuse",
  switch: "Switch",
  joint: "Joint",
  junction: "Junction",
  ground: "Ground",
};

/** One node type per part kind, all drawn by PartView with the kind's symbol. */
export const nodeTypes = {
  battery: PartView,
  alternator: PartView,
  starter: PartView,
  load: PartView,
  fuse: PartView,
  switch: PartView,
  joint: PartView,
  junction: PartView,
  ground: PartView,
} satisfies NodeTypes;
