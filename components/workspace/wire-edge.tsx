"use client";

import { BaseEdge, EdgeLabelRenderer, getSmoothStepPath, useStore, type Edge, type EdgeProps, type EdgeTypes } from "@xyflow/react";
import type { Wire } from "@/lib/circuit";
import type { Band, Overlay, WireFigures } from "@/lib/workspace/analysis";
import { LABEL_MIN_ZOOM, ON_SCREEN_ONLY, useWireFigures, useWireView } from "./canvas-view";

/** What a cable's line and label draw besides its figures: the cable, its size and length, and its band. */
export type WireData = { wire: Wire; overlay: Overlay; conductor: string; band?: Band; over: boolean };
/** A cable's figures as its label shows them for the overlay (current and drop, and heat or ampacity use). */
export type WireFiguresView = { text?: string };
/** The canvas's edge: only its ends; what it shows comes from the canvas view store (canvas-view.tsx). */
export type WireEdgeType = Edge<Record<string, never>, "wire">;


export const BAND_COLOUR: Record<Band, string> = { within: "#2d7a56", caution: "#a86a0c", over: "#b0301f" };

/** The figures a cable's label shows for an overlay. */
function figuresText(f: WireFigures, overlay: Overlay): string {
  const drop = Math.abs(f.drop) < 0.1 ? `${(Math.abs(f.drop) * 1000).toFixed(1)} mV` : `${Math.abs(f.drop).toFixed(3)} V`;
  const extra = overlay === "loss" ? ` · ${f.power.toFixed(1)} W` : overlay === "ampacity" && f.usePercent !== undefined ? ` · ${f.usePercent.toFixed(0)} %` : "";
  return `${Math.abs(f.current).toFixed(1)} A · ${drop}${extra}`;
}

/** A cable's view and figures for the canvas stores, from its figures (undefined before a solve). */
export function wireViews(wire: Wire, f: WireFigures | undefined, overlay: Overlay, conductor: string): [WireData, WireFiguresView] {
  return [
    { wire, overlay, conductor, band: f?.band[overlay], over: Boolean(f && f.over.length > 0) },
    { text: f ? figuresText(f, overlay) : undefined },
  ];
}

/** Whether two cable views draw the same line and label frame. */
export function sameWireView(a: WireData, b: WireData): boolean {
  return a.wire === b.wire && a.overlay === b.overlay && a.conductor === b.conductor && a.band === b.band && a.over === b.over;
}

/** Whether two cables' figures read the same. */
export const sameWireFigures = (a: WireFiguresView, b: WireFiguresView) => a.text === b.text;

/** The figures line of a cable's label: drawn again alone when only the figures change. */
function WireFiguresLine({ id, colour, over }: { id: string; colour: string; over: boolean }) {
  const text = useWireFigures(id)?.text;
  if (text === undefined) return null;
  return (
    <div style={{ color: colour }} className="font-semibold">
      {over ? "▲ " : ""}
      {text}
    </div>
  );
}

/** A cable: its size and length on the line, and once solved its current and drop, coloured by the chosen overlay. */
function WireEdge(props: EdgeProps<WireEdgeType>) {
  const { selected } = props;
  const data = useWireView(props.id);
  const [path, x, y] = getSmoothStepPath({ ...props, borderRadius: 6 });
  const band = data?.band;
  const over = Boolean(data?.over);
  const colour = band ? BAND_COLOUR[band] : "#68737d";
  const direct = data?.wire.resistanceOhm === 0;
  // Zoomed out, the labels would be unreadable and overlap: the line's colour and dash carry the overlay alone.
  const farAway = useStore((st) => st.transform[2] < LABEL_MIN_ZOOM);
  return (
    <>
      <BaseEdge
        id={props.id}
        path={path}
        style={{ stroke: colour, strokeWidth: selected ? 4 : direct ? 2 : 3, strokeDasharray: over ? "8 4" : undefined }}
        interactionWidth={16}
      />
      {(direct || farAway) && !selected ? null : (
        <EdgeLabelRenderer>
          <div
            className={`nodrag nopan pointer-events-auto absolute ${ON_SCREEN_ONLY} rounded border bg-white/95 px-1.5 py-0.5 text-center font-mono text-[10px] leading-tight shadow-sm ${selected ? "border-copper-500" : "border-graphite-100"}`}
            style={{ transform: `translate(-50%, -50%) translate(${x}px, ${y}px)`, containIntrinsicSize: "auto 120px auto 30px" }}
            data-testid={`wire-${props.id}`}
          >
            <div className="text-graphite-700">
              <span className="font-semibold text-graphite-900">{props.id}</span> {data?.conductor}
            </div>
            <WireFiguresLine id={props.id} colour={colour} over={over} />
          </div>
        </EdgeLabelRenderer>
      )}
    </>
  );
}

export const edgeTypes = { wire: WireEdge } satisfies EdgeTypes;
