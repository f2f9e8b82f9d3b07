"use client";

import { useStore } from "@xyflow/react";
import { createContext, useContext, useEffect, useSyncExternalStore, type RefObject } from "react";
import type { PartData, PartFigures } from "./nodes";
import type { WireData, WireFiguresView } from "./wire-edge";

/**
 * What each part and cable on the canvas shows (its settings and, once solved, its figures), kept outside the canvas
 * library's node and edge lists. A re-solve then touches only the parts and cables whose shown figures changed: the
 * canvas's own lists (positions, selection, connections) stay the same objects, so the canvas does not re-measure,
 * re-route or re-run its selectors for every edit.
 */
export class ViewStore<T> {
  private values = new Map<string, T>();
  private listeners = new Map<string, Set<() => void>>();

  constructor(private readonly same: (a: T, b: T) => boolean) {}

  get = (id: string): T | undefined => this.values.get(id);

  subscribe(id: string, listener: () => void): () => void {
    let set = this.listeners.get(id);
    if (!set) this.listeners.set(id, (set = new Set()));
    set.add(listener);
    return () => {
      set.delete(listener);
      if (!set.size) this.listeners.delete(id);
    };
  }

  /** Replaces every value; only the ids whose value draws differently (or appeared, or went) are told. */
  replace(next: Map<string, T>): void {
    const changed: string[] = [];
    for (const [id, value] of next) {
      const old = this.values.get(id);
      if (old !== undefined && (old === value || this.same(old, value))) continue;
      this.values.set(id, value);
      changed.push(id);
    }
    for (const id of this.values.keys()) {
      if (next.has(id)) continue;
      this.values.delete(id);
      changed.push(id);
    }
    for (const id of changed) this.listeners.get(id)?.forEach((l) => l());
  }
}

/** Below this zoom the figures (cables' labels, parts' volts) are left out: too small to read. */
export const LABEL_MIN_ZOOM = 0.5;
/** Figures too small to read when the canvas is zoomed out (see ZoomDetail) leave the layout. */
export const FAR_HIDDEN = "group-data-[far=true]/canvas:hidden";
/**
 * Zoomed in, the figures off screen (parts' volts, cables' labels) are skipped by layout and paint
 * (content-visibility: auto): an edit re-solves every figure, and only those in view are laid out again. Zoomed out,
 * everything is on screen and the browser's per-frame visibility checks would only slow panning, so it is off. Never
 * on a whole part: its terminals must stay laid out for the canvas to find them when a cable is drawn.
 */
export const ON_SCREEN_ONLY = "group-data-[far=false]/canvas:[content-visibility:auto]";

/**
 * Marks the canvas element (a `group/canvas`) as zoomed out with data-far, where the parts' figures would be too
 * small to read: they are then left out of the layout (as the cables' labels are), so a re-solve of a large drawing
 * seen whole does not re-lay out hundreds of unreadable figures. Set on the element directly: crossing the threshold
 * re-renders nothing.
 */
export function ZoomDetail({ target }: { target: RefObject<HTMLDivElement | null> }) {
  const far = useStore((s) => s.transform[2] < LABEL_MIN_ZOOM);
  useEffect(() => {
    target.current?.setAttribute("data-far", String(far));
  }, [far, target]);
  return null;
}

export type CanvasView = { parts: ViewStore<PartData>; partFigures: ViewStore<PartFigures>; wires: ViewStore<WireData>; wireFigures: ViewStore<WireFiguresView> };

export const CanvasViewContext = createContext<CanvasView | null>(null);

function useView<T>(store: ViewStore<T> | undefined, id: string): T | undefined {
  return useSyncExternalStore(
    (listener) => (store ? store.subscribe(id, listener) : () => {}),
    () => store?.get(id),
    () => store?.get(id),
  );
}

/** What a part's node draws. */
export const usePartView = (id: string) => useView(useContext(CanvasViewContext)?.parts, id);
/** A part's figures (its terminals' volts). */
export const usePartFigures = (id: string) => useView(useContext(CanvasViewContext)?.partFigures, id);
/** What a cable's edge draws besides its figures. */
export const useWireView = (id: string) => useView(useContext(CanvasViewContext)?.wires, id);
/** A cable's figures line. */
export const useWireFigures = (id: string) => useView(useContext(CanvasViewContext)?.wireFigures, id);
