/// <reference lib="webworker" />
import type { CircuitDocument } from "@/lib/circuit";
import { solveCircuit } from "@/lib/solver";

/** Solves a large circuit off the main thread: one request in, its result out, tagged so stale answers are dropped. */
self.onmessage = (e: MessageEvent<{ seq: number; doc: CircuitDocument; state: string }>) => {
  const { seq, doc, state } = e.data;
  (self as unknown as DedicatedWorkerGlobalScope).postMessage({ seq, result: solveCircuit(doc, { state }) });
};
