"use client";

import { createContext, useContext, useSyncExternalStore } from "react";
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
