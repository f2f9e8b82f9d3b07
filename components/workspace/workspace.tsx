"use client";

import { Unavailable } from "@/components/ui/unavailable";
import {
  applyNodeChanges,
  getNodesBounds,
  Background,
  ConnectionMode,
  ControlButton,
  Controls,
  MiniMap,
  ReactFlow,
  ReactFlowProvider,
  useReactFlow,
  type Connection,
  type EdgeChange,
  type NodeChange,
} from "@xyflow/react";
import Link from "next/link";
import { useCallback, useDeferredValue, useEffect, useLayoutEffect, useMemo, useRef, useState } from "react";
import { ConflictDialog } from "@/components/circuits/conflict-dialog";
import { IssueList } from "@/components/jobs/job-detail";
import { COMPONENT_KINDS, stateIdsOf, type CircuitDocument, type Component, type ComponentKind, type Wire } from "@/lib/circuit";
import { staleVersionOf, useCircuit, useReadings, useSaveCircuit, type StaleVersion } from "@/lib/hooks/circuits";
import { solveCircuit, type SolveResult } from "@/lib/solver";
import { fromSI } from "@/lib/units";
import { assess, CANVAS_LIMITS, type Overlay } from "@/lib/workspace/analysis";
import { addComponent, addWire, copyItems, freeSpot, KIND_NAMES, moveComponents, pasteItems, removeItems, updateComponent, updateWire, withPositions, type Clip } from "@/lib/workspace/edit";
import { supplyCheck, supplyRow, type SupplyRow } from "@/lib/workspace/supply";
import { AddLoadDialog } from "./add-load-dialog";
import { exportCanvas } from "./export";
import { CanvasViewContext, ViewStore, ZoomDetail, type CanvasView } from "./canvas-view";
import { nodeTypes, samePartFigures, samePartView, type PartData, type PartFigures, type PartNode } from "./nodes";
import { DEFAULT_PREFS, sizeShown, type UnitPrefs } from "@/lib/workspace/prefs";
import { PropertiesPanel } from "./properties-panel";
import { ReadingMarkers } from "./reading-markers";
import { ResultsTable } from "./results-table";
import { Symbol } from "./symbols";
import { BAND_COLOUR, edgeTypes, sameWireFigures, sameWireView, wireViews, type WireData, type WireEdgeType, type WireFiguresView } from "./wire-edge";

const HISTORY_LIMIT = 100;
const SAVE_DELAY_MS = 1200;
/**
 * Circuits this large are solved in a Web Worker, so the page keeps working while it solves. Below it the solve
 * (under 1 ms at 300 parts, about 3 ms at 1,000 by npm run bench) runs in the render of the edit itself: one render
 * instead of two and no message round trip (bench:ui).
 */
const WORKER_FROM_COMPONENTS = 1500;

// The canvas's settings as constants: a new array or object on every render would reach the canvas as a change.
const DELETE_KEYS = ["Delete", "Backspace"];
const MULTI_SELECT_KEYS = ["Shift", "Meta", "Control"];
const SNAP_GRID: [number, number] = [20, 20];
const PRO_OPTIONS = { hideAttribution: true };
const MINIMAP_STYLE = { width: 150, height: 100 };
/** Room (in canvas units) around the parts when the whole drawing is fitted: cables that run round the outside
 * carry their labels beyond the parts. */
const FIT_MARGIN = { x: 90, y: 40 };

/** The last edge made for each cable object, and whether it was selected (see edges below). */
const edgeCache = new WeakMap<Wire, { selected: boolean; edge: WireEdgeType }>();

/** The list itself when every item is the same object as before: the canvas then has nothing to redo. */
function keepIfSame<T>(prev: T[], next: T[]): T[] {
  return prev.length === next.length && next.every((x, i) => x === prev[i]) ? prev : next;
}

type SaveState = { kind: "saved"; version: number } | { kind: "dirty" } | { kind: "saving" } | { kind: "error"; message: string };

function usePrefs(): [UnitPrefs, (p: UnitPrefs) => void] {
  const [prefs, setPrefs] = useState<UnitPrefs>(DEFAULT_PREFS);
  useEffect(() => {
    try {
      const saved = JSON.parse(localStorage.getItem("ampwright.units") ?? "null") as UnitPrefs | null;
      // eslint-disable-next-line react-hooks/set-state-in-effect -- read once from this browser after hydration
      if (saved?.length) setPrefs({ ...DEFAULT_PREFS, ...saved });
    } catch {
      // a malformed preference is ignored
    }
  }, []);
  return [
    prefs,
    (p) => {
      setPrefs(p);
      localStorage.setItem("ampwright.units", JSON.stringify(p));
    },
  ];
}

/** The circuit workspace: load, edit on the canvas with undo, solve live, and save each change as a new version. */
export function Workspace({ circuitId, focus, state, readings }: { circuitId: string; focus?: string[]; state?: string; readings?: boolean }) {
  const { data, error } = useCircuit(circuitId);
  if (error) return <Unavailable title="This circuit cannot be opened" message={error.message} className="mx-auto max-w-3xl px-4 py-10" />;
  if (!data) return <p className="px-4 py-10 text-graphite-500">Opening the circuit...</p>;
  return (
    <ReactFlowProvider>
      <Editor circuitId={circuitId} initial={withPositions(data.circuit.document)} version={data.circuit.version} jobId={data.circuit.jobId} jobTitle={data.circuit.jobTitle} canEdit={data.canEdit} focus={focus} initialState={state} showReadings={readings} />
    </ReactFlowProvider>
  );
}

/**
 * A circuit explored read-only: the same canvas, live solve, states and overlays as the workspace, for a document
 * that is not a saved circuit of the viewer's (a lesson's snapshot). Nothing can be changed or saved.
 */
export function CircuitExplorer({ document, readOnlyNote }: { document: CircuitDocument; readOnlyNote: string }) {
  return (
    <ReactFlowProvider>
      <Editor initial={withPositions(document)} version={0} canEdit={false} readOnlyNote={readOnlyNote} />
    </ReactFlowProvider>
  );
}

function Editor(props: {
  circuitId?: string;
  initial: CircuitDocument;
  version: number;
  jobId?: string;
  jobTitle?: string;
  canEdit: boolean;
  readOnlyNote?: string;
  /** Parts or cables to choose and centre on when the canvas opens (a test plan's suspect). */
  focus?: string[];
  initialState?: string;
  /** Start with the meter readings drawn on the canvas (they are off by default: they crowd a busy drawing). */
  showReadings?: boolean;
}) {
  const flow = useReactFlow();
  const [doc, setDoc] = useState(props.initial);
  const [history, setHistory] = useState<{ past: CircuitDocument[]; future: CircuitDocument[] }>({ past: [], future: [] });
  const [stateId, setStateId] = useState(props.initialState && stateIdsOf(props.initial).includes(props.initialState) ? props.initialState : "base");
  const [overlay, setOverlay] = useState<Overlay>("drop");
  const [prefs, setPrefs] = usePrefs();
  const [nodes, setNodes] = useState<PartNode[]>([]);
  const [selectedEdges, setSelectedEdges] = useState<string[]>([]);
  const [notice, setNotice] = useState<string | null>(null);
  const clip = useRef<Clip | null>(null);
  const wrapper = useRef<HTMLDivElement>(null);

  // ---- saving: every committed change becomes a version, named by the version it was made from
  const base = useRef(props.version);
  const [save, setSave] = useState<SaveState>({ kind: "saved", version: props.version });
  const [conflict, setConflict] = useState<{ mine: CircuitDocument; theirs: StaleVersion; baseVersion: number } | null>(null);
  const saver = useSaveCircuit(props.circuitId ?? "");
  const savedDoc = useRef(props.initial);
  const [savedShown, setSavedShown] = useState(props.initial);

  // The document as of the last commit or render, for the canvas's handlers: they read it here instead of closing
  // over it, so they keep their identity across edits and the canvas library is not told of new handlers each time.
  const docRef = useRef(doc);
  useLayoutEffect(() => {
    docRef.current = doc;
  }, [doc]);
  const commit = useCallback(
    (next: CircuitDocument) => {
      if (!props.canEdit) return;
      const prev = docRef.current;
      setHistory((h) => ({ past: [...h.past.slice(-HISTORY_LIMIT + 1), prev], future: [] }));
      setDoc(next);
      docRef.current = next;
    },
    [props.canEdit],
  );
  const undo = useCallback(() => {
    const prev = history.past[history.past.length - 1];
    if (!prev) return;
    setHistory({ past: history.past.slice(0, -1), future: [...history.future, doc] });
    setDoc(prev);
  }, [doc, history]);
  const redo = useCallback(() => {
    const next = history.future[history.future.length - 1];
    if (!next) return;
    setHistory({ past: [...history.past, doc], future: history.future.slice(0, -1) });
    setDoc(next);
  }, [doc, history]);

  // One save at a time: a change made while one is on its way is sent after it, over the version it produced.
  const inFlight = useRef(false);
  const latest = useRef(doc);
  const [saveTick, setSaveTick] = useState(0);
  useEffect(() => {
    latest.current = doc;
    if (!props.canEdit || doc === savedDoc.current || conflict) return;
    const t = setTimeout(() => {
      if (inFlight.current) return; // the running save's success schedules the next
      const sending = doc;
      inFlight.current = true;
      setSave({ kind: "saving" });
      saver.mutate(
        { document: sending, baseVersion: base.current },
        {
          onSuccess: (res) => {
            base.current = res.version;
            savedDoc.current = sending;
            setSavedShown(sending);
            setSave({ kind: "saved", version: res.version });
          },
          onError: (err) => {
            const theirs = staleVersionOf(err);
            if (theirs) {
              setConflict({ mine: sending, theirs, baseVersion: base.current });
              setSave({ kind: "dirty" });
            } else setSave({ kind: "error", message: err.message });
          },
          onSettled: () => {
            inFlight.current = false;
            if (latest.current !== savedDoc.current) setSaveTick((n) => n + 1);
          },
        },
      );
    }, SAVE_DELAY_MS);
    return () => clearTimeout(t);
    // saver's identity changes with its state; re-running on it would resend
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [doc, conflict, props.canEdit, saveTick]);
  const shownSave: SaveState = save.kind === "saved" && doc !== savedShown ? { kind: "dirty" } : save;

  // ---- live solve of the chosen operating state: a small circuit in the same render as the edit, a large one in a
  // worker (the page stays responsive while it works; an answer for an older edit is dropped)
  const solveState = stateIdsOf(doc).includes(stateId) ? stateId : "base";
  const inWorker = doc.components.length >= WORKER_FROM_COMPONENTS && typeof Worker !== "undefined";
  const nearResult = useMemo(() => (inWorker ? undefined : solveCircuit(doc, { state: solveState })), [doc, solveState, inWorker]);
  const [farResult, setFarResult] = useState<SolveResult>();
  const worker = useRef<Worker | null>(null);
  const asked = useRef(0);
  useEffect(() => () => worker.current?.terminate(), []);
  useEffect(() => {
    if (!inWorker) return;
    if (!worker.current) {
      worker.current = new Worker(new URL("./solve.worker.ts", import.meta.url));
      worker.current.onmessage = (e: MessageEvent<{ seq: number; result: SolveResult }>) => {
        if (e.data.seq === asked.current) setFarResult(e.data.result);
      };
    }
    worker.current.postMessage({ seq: ++asked.current, doc, state: solveState });
  }, [doc, solveState, inWorker]);
  const result = inWorker ? farResult : nearResult;

  const figures = useMemo(() => assess(doc, result), [doc, result]);
  const readings = useReadings(props.circuitId ?? "", Boolean(props.circuitId));
  const [showReadings, setShowReadings] = useState(Boolean(props.showReadings));
  const figureById = useMemo(() => new Map(figures.map((f) => [f.id, f])), [figures]);
  // The table follows a moment later (a deferred render after the frame that shows the canvas): the canvas's overlay
  // is what an edit is watched on, and sorting and drawing the table's rows would delay it.
  const tableRows = useDeferredValue(figures);

  // ---- what each part and cable shows lives in the canvas view stores (see canvas-view.tsx); the canvas's own node
  // and edge lists carry only kinds, places, connections and selection, so a re-solve leaves them alone.
  const [view] = useState<CanvasView>(() => ({
    parts: new ViewStore<PartData>(samePartView),
    partFigures: new ViewStore<PartFigures>(samePartFigures),
    wires: new ViewStore<WireData>(sameWireView),
    wireFigures: new ViewStore<WireFiguresView>(sameWireFigures),
  }));
  const conductor = useCallback(
    (w: Wire) => {
      if (w.resistanceOhm !== undefined) return w.resistanceOhm === 0 ? "link" : `${+(w.resistanceOhm * 1000).toPrecision(3)} mΩ`;
      const len = prefs.length === "ft" ? `${fromSI(w.lengthM ?? 0, "length", "ft").toFixed(1)} ft` : `${(w.lengthM ?? 0).toFixed(2)} m`;
      return `${sizeShown(w.size ?? "", prefs)} · ${len}`;
    },
    [prefs],
  );
  // Before the browser paints: the edit and its figures appear in the same frame.
  useLayoutEffect(() => {
    const voltsByPart = new Map<string, Record<string, number>>();
    if (result) {
      for (const [k, v] of Object.entries(result.terminals)) {
        const dot = k.lastIndexOf(".");
        const id = k.slice(0, dot);
        let rec = voltsByPart.get(id);
        if (!rec) voltsByPart.set(id, (rec = {}));
        rec[k.slice(dot + 1)] = v;
      }
    }
    const parts = new Map<string, PartData>();
    const partFigures = new Map<string, PartFigures>();
    for (const c of doc.components) {
      const comp = result?.components[c.id];
      const f = c.kind === "joint" ? figureById.get(c.id) : undefined;
      partFigures.set(c.id, { volts: result ? (voltsByPart.get(c.id) ?? {}) : undefined });
      parts.set(c.id, {
        component: c,
        band: f?.band.drop,
        off: comp?.mode === "off" || comp?.mode === "open",
        note: comp?.mode ? `mode: ${comp.mode}` : undefined,
      });
    }
    const wires = new Map<string, WireData>();
    const wireFigures = new Map<string, WireFiguresView>();
    for (const w of doc.wires) {
      const [look, figs] = wireViews(w, figureById.get(w.id), overlay, conductor(w));
      wires.set(w.id, look);
      wireFigures.set(w.id, figs);
    }
    view.parts.replace(parts);
    view.partFigures.replace(partFigures);
    view.wires.replace(wires);
    view.wireFigures.replace(wireFigures);
  }, [doc, result, figureById, overlay, conductor, view]);

  // Canvas nodes follow the document's parts; xyflow's own measurements and selection are kept, and a part that did
  // not move keeps its node object (and the list itself is kept when nothing moved).
  useEffect(() => {
    // eslint-disable-next-line react-hooks/set-state-in-effect -- nodes are derived from the document but keep xyflow's measurements
    setNodes((prev) => {
      const old = new Map(prev.map((n) => [n.id, n]));
      const next = doc.components.map((c) => {
        const o = old.get(c.id);
        // By value: an edited part is a new object whose position may be a copy of the same place.
        const at = c.position ?? { x: 0, y: 0 };
        if (o && (o.dragging || (o.position.x === at.x && o.position.y === at.y && o.type === c.kind))) return o;
        return { ...(o ?? {}), id: c.id, type: c.kind, position: at, data: {} } as PartNode;
      });
      return keepIfSame(prev, next);
    });
  }, [doc]);

  // The whole drawing in view, with room at the sides for the labels of cables that run round the outside.
  const fitWhole = useCallback(() => {
    const nodes = flow.getNodes();
    if (!nodes.length) return;
    const b = getNodesBounds(nodes);
    void flow.fitBounds({ x: b.x - FIT_MARGIN.x, y: b.y - FIT_MARGIN.y, width: b.width + 2 * FIT_MARGIN.x, height: b.height + 2 * FIT_MARGIN.y }, { padding: 0.05 });
  }, [flow]);
  // A circuit begun empty keeps the view it has: fitting the first part dropped would zoom onto it, and the next
  // parts dropped where the user meant would land on top of it.
  const [startedEmpty] = useState(() => props.initial.components.length === 0);
  // Fit the drawing once its parts have been measured; a part asked for in the address (a test plan's suspect) is
  // fitted instead, with the parts its cables join.
  const fitted = useRef(startedEmpty);
  useEffect(() => {
    if (fitted.current || !nodes.length || !result || !nodes.every((n) => n.measured)) return;
    fitted.current = true;
    const focus = props.focus?.length ? new Set(props.focus) : null;
    if (focus) for (const w of doc.wires) if (focus.has(w.id)) [w.from, w.to].forEach((t) => focus.add(t.slice(0, t.lastIndexOf("."))));
    // After the panels have taken their size, so the drawing fits the canvas it ends up in.
    setTimeout(() => void (focus ? flow.fitView({ nodes: [...focus].map((id) => ({ id })), maxZoom: 1.2, padding: 0.6, duration: 300 }) : fitWhole()), 100);
  }, [nodes, flow, result, props.focus, doc.wires, fitWhole]);

  // Made again only when the cables or the selection change (an edit to a part keeps doc.wires).
  const edges: WireEdgeType[] = useMemo(
    () =>
      doc.wires.map((w) => {
        const selected = selectedEdges.includes(w.id);
        const kept = edgeCache.get(w);
        if (kept?.selected === selected) return kept.edge;
        const [s, sh] = w.from.split(".");
        const [t, th] = w.to.split(".");
        const edge: WireEdgeType = { id: w.id, type: "wire", source: s, sourceHandle: sh, target: t, targetHandle: th, selected, data: {} };
        edgeCache.set(w, { selected, edge });
        return edge;
      }),
    [doc.wires, selectedEdges],
  );

  const selectedNodes = nodes.filter((n) => n.selected).map((n) => n.id);
  const onNodesChange = useCallback(
    (changes: NodeChange<PartNode>[]) => {
      const removed = changes.filter((c) => c.type === "remove").map((c) => c.id);
      if (removed.length) {
        commit(removeItems(docRef.current, removed, []));
        return;
      }
      setNodes((ns) => applyNodeChanges(changes, ns));
      if (changes.some((c) => c.type === "select" && c.selected)) setSelectedEdges([]);
    },
    [commit],
  );
  const onEdgesChange = useCallback(
    (changes: EdgeChange<WireEdgeType>[]) => {
      const removed = changes.filter((c) => c.type === "remove").map((c) => c.id);
      if (removed.length) {
        commit(removeItems(docRef.current, [], removed));
        setSelectedEdges([]);
        return;
      }
      for (const c of changes) {
        if (c.type !== "select") continue;
        setSelectedEdges((s) => (c.selected ? [...new Set([...s, c.id])] : s.filter((x) => x !== c.id)));
      }
    },
    [commit],
  );
  const onConnect = useCallback(
    (c: Connection) => {
      if (!c.sourceHandle || !c.targetHandle) return;
      const r = addWire(docRef.current, `${c.source}.${c.sourceHandle}`, `${c.target}.${c.targetHandle}`);
      if (r.refused) setNotice(r.refused);
      else commit(r.doc);
    },
    [commit],
  );
  const onDragStop = useCallback(
    (_e: unknown, _n: PartNode, dragged: PartNode[]) => {
      commit(moveComponents(docRef.current, new Map(dragged.map((n) => [n.id, n.position]))));
    },
    [commit],
  );

  const select = useCallback((ids: string[]) => {
    const wireIds = new Set(doc.wires.map((w) => w.id));
    setSelectedEdges(ids.filter((i) => wireIds.has(i)));
    // Only the nodes whose selection changes are new objects: the canvas redraws those alone.
    setNodes((ns) => ns.map((n) => (Boolean(n.selected) === ids.includes(n.id) ? n : { ...n, selected: ids.includes(n.id) })));
  }, [doc.wires]);
  const pickRow = useCallback((id: string) => select([id]), [select]);

  // A part asked for in the address (a test plan's suspect) is chosen once the canvas has its nodes (and centred once
  // they are measured, above).
  const focused = useRef(false);
  useEffect(() => {
    if (focused.current || !props.focus?.length || !nodes.length) return;
    focused.current = true;
    select(props.focus);
  }, [nodes.length, props.focus, select]);

  const addPart = useCallback(
    (kind: ComponentKind, at?: { x: number; y: number }) => {
      const box = wrapper.current?.getBoundingClientRect();
      const pos = at ?? flow.screenToFlowPosition({ x: (box?.left ?? 0) + (box?.width ?? 600) / 2, y: (box?.top ?? 0) + (box?.height ?? 400) / 2 });
      const r = addComponent(doc, kind, freeSpot(doc, pos));
      commit(r.doc);
      setTimeout(() => select([r.id]), 0);
    },
    [commit, doc, flow, select],
  );

  const onKeyDown = (e: React.KeyboardEvent) => {
    const el = e.target as HTMLElement;
    if (el.closest("input, select, textarea")) return;
    const mod = e.ctrlKey || e.metaKey;
    if (!mod) return;
    const k = e.key.toLowerCase();
    if (k === "z" && !e.shiftKey) undo();
    else if ((k === "z" && e.shiftKey) || k === "y") redo();
    else if (k === "c") clip.current = copyItems(doc, selectedNodes);
    else if (k === "v" && clip.current?.components.length) {
      const r = pasteItems(doc, clip.current);
      commit(r.doc);
      setTimeout(() => select(r.ids), 0);
    } else if (k === "d" && selectedNodes.length) {
      const r = pasteItems(doc, copyItems(doc, selectedNodes));
      commit(r.doc);
      setTimeout(() => select(r.ids), 0);
    } else return;
    e.preventDefault();
  };

  // ---- what the panel edits: in a named state, a part's changes go to that state's overrides
  const activeState = doc.states?.find((s) => s.id === stateId);
  const onlyNode = selectedNodes.length === 1 && selectedEdges.length === 0 ? doc.components.find((c) => c.id === selectedNodes[0]) : undefined;
  const onlyWire = selectedEdges.length === 1 && selectedNodes.length === 0 ? doc.wires.find((w) => w.id === selectedEdges[0]) : undefined;
  const effective = (c: Component): Component => (activeState?.set[c.id] ? ({ ...c, ...activeState.set[c.id] } as Component) : c);
  const applyComponent = (base: Component, next: Component) => {
    if (!activeState) return commit(updateComponent(doc, base.id, next));
    const diff: Record<string, string | number | boolean> = {};
    for (const [k, v] of Object.entries(next)) {
      if (k === "id" || k === "kind" || k === "position" || k === "label") continue;
      if (JSON.stringify((base as Record<string, unknown>)[k]) !== JSON.stringify(v) && (typeof v === "number" || typeof v === "boolean" || typeof v === "string")) diff[k] = v;
    }
    commit({ ...doc, states: (doc.states ?? []).map((s) => (s.id === activeState.id ? { ...s, set: { ...s.set, [base.id]: diff } } : s)) });
  };

  const [addingLoad, setAddingLoad] = useState(false);
  const [allSupply, setAllSupply] = useState<{ doc: CircuitDocument; rows: SupplyRow[] } | null>(null);
  const supplyNow = useMemo(() => (result ? supplyRow(doc, stateId, result) : null), [doc, stateId, result]);
  // The every-state list belongs to the document it was worked out for.
  const shownAllSupply = allSupply?.doc === doc ? allSupply.rows : null;

  const [newState, setNewState] = useState("");
  const addState = () => {
    const name = newState.trim();
    if (!name) return;
    const id = name.toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-|-$/g, "").slice(0, 40) || "state";
    const unique = stateIdsOf(doc).includes(id) ? `${id}-${stateIdsOf(doc).length}` : id;
    commit({ ...doc, states: [...(doc.states ?? []), { id: unique, name, set: {} }] });
    setStateId(unique);
    setNewState("");
  };

  const errors = result?.issues.filter((i) => i.severity === "error") ?? [];
  const warnings = result?.issues.filter((i) => i.severity === "warning") ?? [];
  const overCount = figures.filter((f) => f.over.length).length;

  return (
    <div className="flex min-h-[calc(100dvh-8rem)] flex-col" onKeyDown={onKeyDown}>
      <div className="flex flex-wrap items-center gap-x-4 gap-y-2 border-b border-graphite-100 bg-paper-raised px-4 py-2">
        <div className="min-w-0">
          {props.jobId ? (
            <p className="text-xs text-graphite-500">
              <Link href={`/jobs/${props.jobId}`} className="underline-offset-2 hover:underline">
                {props.jobTitle}
              </Link>{" "}
              /{" "}
              <Link href={`/circuits/${props.circuitId}`} className="underline-offset-2 hover:underline">
                readings and history
              </Link>
            </p>
          ) : null}
          <h1 className="truncate text-lg font-semibold" data-testid="ws-title">
            {doc.name}
          </h1>
        </div>
        <label className="text-sm">
          <span className="mr-1 text-graphite-700">Operating state</span>
          <select value={stateId} onChange={(e) => setStateId(e.target.value)} className="rounded border border-graphite-300 bg-white px-2 py-1" data-testid="ws-state">
            <option value="base">Base (as drawn)</option>
            {(doc.states ?? []).map((s) => (
              <option key={s.id} value={s.id}>
                {s.name}
              </option>
            ))}
          </select>
        </label>
        <label className="text-sm">
          <span className="mr-1 text-graphite-700">Colour by</span>
          <select value={overlay} onChange={(e) => setOverlay(e.target.value as Overlay)} className="rounded border border-graphite-300 bg-white px-2 py-1" data-testid="ws-overlay">
            <option value="drop">voltage drop</option>
            <option value="loss">heat (power loss)</option>
            <option value="ampacity">ampacity use</option>
          </select>
        </label>
        {readings.data?.length ? (
          <label className="flex items-center gap-1 text-sm">
            <input type="checkbox" checked={showReadings} onChange={(e) => setShowReadings(e.target.checked)} data-testid="ws-show-readings" />
            <span className="text-graphite-700">Readings ({readings.data.filter((r) => r.stateId === solveState).length} in this state)</span>
          </label>
        ) : null}
        <label className="text-sm">
          <span className="mr-1 text-graphite-700">Lengths in</span>
          <select value={prefs.length} onChange={(e) => setPrefs({ ...prefs, length: e.target.value as UnitPrefs["length"] })} className="rounded border border-graphite-300 bg-white px-2 py-1" data-testid="ws-length-unit">
            <option value="m">metres</option>
            <option value="ft">feet</option>
          </select>
        </label>
        <label className="text-sm">
          <span className="mr-1 text-graphite-700">Sizes in</span>
          <select value={prefs.size} onChange={(e) => setPrefs({ ...prefs, size: e.target.value as UnitPrefs["size"] })} className="rounded border border-graphite-300 bg-white px-2 py-1" data-testid="ws-size-unit">
            <option value="awg">AWG</option>
            <option value="mm2">mm²</option>
          </select>
        </label>
        <label className="text-sm">
          <span className="mr-1 text-graphite-700">Temperatures in</span>
          <select value={prefs.temperature} onChange={(e) => setPrefs({ ...prefs, temperature: e.target.value as UnitPrefs["temperature"] })} className="rounded border border-graphite-300 bg-white px-2 py-1" data-testid="ws-temp-unit">
            <option value="degC">°C</option>
            <option value="degF">°F</option>
          </select>
        </label>
        <div className="flex gap-1">
          <button type="button" onClick={undo} disabled={!history.past.length || !props.canEdit} className="rounded border border-graphite-300 px-2 py-1 text-sm disabled:opacity-40" aria-keyshortcuts="Control+Z" data-testid="ws-undo">
            Undo
          </button>
          <button type="button" onClick={redo} disabled={!history.future.length || !props.canEdit} className="rounded border border-graphite-300 px-2 py-1 text-sm disabled:opacity-40" aria-keyshortcuts="Control+Shift+Z" data-testid="ws-redo">
            Redo
          </button>
          {props.canEdit ? (
            <button type="button" onClick={() => setAddingLoad(true)} className="rounded border border-copper-600 px-2 py-1 text-sm font-medium text-copper-700" data-testid="ws-add-load">
              Add a load…
            </button>
          ) : null}
          <button type="button" onClick={() => void exportCanvas(wrapper.current, nodes, doc.name, "svg")} className="rounded border border-graphite-300 px-2 py-1 text-sm" data-testid="ws-export-svg">
            SVG
          </button>
          <button type="button" onClick={() => void exportCanvas(wrapper.current, nodes, doc.name, "png")} className="rounded border border-graphite-300 px-2 py-1 text-sm" data-testid="ws-export-png">
            PNG
          </button>
        </div>
        <p className="ml-auto text-sm" role="status" data-testid="ws-save">
          {!props.canEdit
            ? (props.readOnlyNote ?? "Read only")
            : shownSave.kind === "saved"
              ? `Saved, version ${shownSave.version}`
              : shownSave.kind === "saving"
                ? "Saving..."
                : shownSave.kind === "dirty"
                  ? "Unsaved changes"
                  : `Not saved: ${shownSave.message}`}
        </p>
      </div>

      <div className="grid flex-1 grid-cols-1 lg:grid-cols-[11rem_minmax(0,1fr)_19rem]">
        <aside className="order-2 border-b border-graphite-100 bg-paper-raised p-3 lg:order-1 lg:border-r" aria-label="Parts to add">
          <h2 className="text-xs font-semibold uppercase tracking-wider text-graphite-500">Add a part</h2>
          <ul className="mt-2 grid grid-cols-3 gap-1 sm:grid-cols-5 lg:grid-cols-1">
            {COMPONENT_KINDS.map((k) => (
              <li key={k}>
                <button
                  type="button"
                  draggable={props.canEdit}
                  disabled={!props.canEdit}
                  onDragStart={(e) => e.dataTransfer.setData("application/x-ampwright-part", k)}
                  onClick={() => addPart(k)}
                  className="flex w-full items-center gap-2 rounded border border-transparent px-1.5 py-1 text-left text-xs hover:border-graphite-300 hover:bg-white disabled:opacity-40"
                  data-testid={`palette-${k}`}
                >
                  <Symbol kind={k} className="h-5 w-8 shrink-0" />
                  {KIND_NAMES[k]}
                </button>
              </li>
            ))}
          </ul>
          <p className="mt-3 text-xs text-graphite-500">Click to place in the middle, or drag onto the canvas. Join parts by dragging from one terminal dot to another.</p>
        </aside>

        <div
          ref={wrapper}
          className="group/canvas order-1 h-[60dvh] min-h-[380px] border-b border-graphite-100 bg-white lg:order-2 lg:h-auto lg:min-h-[600px]"
          onDragOver={(e) => {
            if (e.dataTransfer.types.includes("application/x-ampwright-part")) e.preventDefault();
          }}
          onDrop={(e) => {
            const kind = e.dataTransfer.getData("application/x-ampwright-part") as ComponentKind;
            if (!COMPONENT_KINDS.includes(kind)) return;
            e.preventDefault();
            addPart(kind, flow.screenToFlowPosition({ x: e.clientX, y: e.clientY }));
          }}
          data-testid="ws-canvas"
          data-far="false"
        >
          <CanvasViewContext.Provider value={view}>
            <ReactFlow
              nodes={nodes}
              edges={edges}
              nodeTypes={nodeTypes}
              edgeTypes={edgeTypes}
              onNodesChange={onNodesChange}
              onEdgesChange={onEdgesChange}
              onConnect={onConnect}
              onNodeDragStop={onDragStop}
              connectionMode={ConnectionMode.Loose}
              nodesDraggable={props.canEdit}
              nodesConnectable={props.canEdit}
              deleteKeyCode={props.canEdit ? DELETE_KEYS : null}
              multiSelectionKeyCode={MULTI_SELECT_KEYS}
              snapToGrid
              snapGrid={SNAP_GRID}
              fitView={!startedEmpty}
              minZoom={0.1}
              proOptions={PRO_OPTIONS}
            >
              <ZoomDetail target={wrapper} />
              <Background gap={20} size={1} color="#e4e7ea" />
              <Controls showInteractive={false} showFitView={false}>
                {/* Our own fit button: it leaves room for the labels of cables that run round the outside. */}
                <ControlButton onClick={fitWhole} title="Fit the whole drawing" aria-label="Fit the whole drawing" data-testid="ws-fit">
                  <svg viewBox="0 0 16 16" fill="none" stroke="currentColor" strokeWidth="1.6" aria-hidden="true">
                    <path d="M2 6V2h4M10 2h4v4M14 10v4h-4M6 14H2v-4" />
                  </svg>
                </ControlButton>
              </Controls>
              {showReadings && readings.data?.length ? <ReadingMarkers doc={doc} readings={readings.data} stateId={solveState} nodes={nodes} /> : null}
              <MiniMap pannable zoomable position="top-right" className="!hidden xl:!block" style={MINIMAP_STYLE} nodeStrokeWidth={2} />
            </ReactFlow>
          </CanvasViewContext.Provider>
        </div>

        <aside className="order-3 space-y-4 bg-paper-raised p-3 lg:border-l" aria-label="Settings and problems">
          {notice ? (
            <p className="rounded bg-caution-soft px-2 py-1 text-sm" role="status">
              {notice}{" "}
              <button type="button" className="underline" onClick={() => setNotice(null)}>
                OK
              </button>
            </p>
          ) : null}
          {onlyNode || onlyWire ? (
            // On a phone the chosen item's settings rise as a sheet over the canvas, closed by its button.
            <div className="max-lg:fixed max-lg:inset-x-0 max-lg:bottom-0 max-lg:z-40 max-lg:max-h-[65dvh] max-lg:overflow-y-auto max-lg:rounded-t-xl max-lg:border-t max-lg:border-graphite-300 max-lg:bg-paper-raised max-lg:mb-0! max-lg:p-4 max-lg:shadow-2xl" role="region" aria-label="Settings of the chosen item" data-testid="ws-sheet">
              <div className="mb-2 flex justify-end lg:hidden">
                <button type="button" onClick={() => select([])} className="rounded border border-graphite-300 px-2 py-1 text-sm" data-testid="ws-sheet-close">
                  Close
                </button>
              </div>
          {onlyNode ? (
            <PropertiesPanel
              key={`${onlyNode.id}-${stateId}`}
              item={{ kind: "component", value: effective(onlyNode), base: onlyNode }}
              prefs={prefs}
              stateName={activeState?.name}
              readOnly={!props.canEdit}
              onApply={(next) => applyComponent(onlyNode, next as Component)}
              onDelete={() => commit(removeItems(doc, [onlyNode.id], []))}
            />
          ) : onlyWire ? (
            <PropertiesPanel
              key={onlyWire.id}
              item={{ kind: "wire", value: onlyWire }}
              prefs={prefs}
              readOnly={!props.canEdit}
              onApply={(next) => commit(updateWire(doc, onlyWire.id, next as Wire))}
              onDelete={() => commit(removeItems(doc, [], [onlyWire.id]))}
            />
          ) : null}
            </div>
          ) : (
            <div className="text-sm text-graphite-700">
              <h2 className="font-semibold text-graphite-900">Nothing chosen</h2>
              <p className="mt-1">Click a part or a cable to see and change its settings. Shift-click to choose several; Delete removes them; Ctrl+C, Ctrl+V and Ctrl+D copy, paste and duplicate.</p>
            </div>
          )}

          <section aria-label="Operating states">
            <h2 className="text-xs font-semibold uppercase tracking-wider text-graphite-500">Operating states</h2>
            <p className="mt-1 text-xs text-graphite-700">
              {activeState ? `Changes made while "${activeState.name}" is chosen are kept for that state only.` : "Base is the circuit as drawn. Add a state for cranking, charging or an added load."}
            </p>
            {props.canEdit ? (
              <div className="mt-2 flex gap-1">
                <input value={newState} onChange={(e) => setNewState(e.target.value)} placeholder="e.g. Winch pulling" className="min-w-0 flex-1 rounded border border-graphite-300 bg-white px-2 py-1 text-sm" aria-label="New state name" data-testid="ws-new-state" />
                <button type="button" onClick={addState} className="rounded border border-graphite-300 px-2 py-1 text-sm" data-testid="ws-add-state">
                  Add
                </button>
              </div>
            ) : null}
          </section>

          <section aria-label="Supply" data-testid="ws-supply">
            <h2 className="text-xs font-semibold uppercase tracking-wider text-graphite-500">Supply</h2>
            {supplyNow ? (
              <p className={`mt-1 text-sm ${supplyNow.verdict === "deficit" ? "text-over" : ""}`} data-testid="ws-supply-now">
                {supplyNow.verdict === "deficit" ? "▲ " : ""}
                {supplyNow.message}
              </p>
            ) : null}
            {shownAllSupply ? (
              <ul className="mt-1 space-y-1 text-xs" data-testid="ws-supply-all">
                {shownAllSupply.map((r) => (
                  <li key={r.stateId}>
                    <button type="button" className="text-left hover:underline" onClick={() => setStateId(r.stateId)}>
                      {r.verdict === "deficit" ? "▲ " : ""}
                      {r.message}
                    </button>
                  </li>
                ))}
              </ul>
            ) : (
              <button
                type="button"
                className="mt-1 text-xs underline"
                onClick={() => setAllSupply({ doc, rows: supplyCheck(doc) })}
                data-testid="ws-supply-check"
              >
                Check every state
              </button>
            )}
          </section>

          <section aria-label="Problems" data-testid="ws-problems">
            <h2 className="text-xs font-semibold uppercase tracking-wider text-graphite-500">Problems</h2>
            {errors.length + warnings.length === 0 && overCount === 0 ? (
              <p className="mt-1 text-sm text-within">None: the circuit solves and nothing is over its limit.</p>
            ) : (
              <ul className="mt-1 space-y-1 text-sm">
                {[...errors, ...warnings].map((i, n) => (
                  <li key={`${i.code}-${n}`}>
                    <button type="button" onClick={() => select(i.ids)} className="text-left hover:underline">
                      <span className={i.severity === "error" ? "font-semibold text-over" : "font-semibold text-caution"}>{i.severity === "error" ? "Error" : "Warning"}:</span> {i.message}
                    </button>
                  </li>
                ))}
                {figures
                  .filter((f) => f.over.length)
                  .map((f) => (
                    <li key={`over-${f.id}`}>
                      <button type="button" onClick={() => select([f.id])} className="text-left hover:underline">
                        <span className="font-semibold text-over">Over:</span> {f.id} ({f.label}) {f.over.includes("drop") ? `drops ${Math.abs(f.drop).toFixed(3)} V` : ""}
                        {f.over.includes("ampacity") ? ` carries ${f.usePercent?.toFixed(0)} % of its ampacity` : ""}
                      </button>
                    </li>
                  ))}
              </ul>
            )}
          </section>

          <section aria-label="Legend" className="text-xs text-graphite-700" data-testid="ws-legend">
            <h2 className="font-semibold uppercase tracking-wider text-graphite-500">Legend</h2>
            <ul className="mt-1 space-y-0.5">
              <li>
                <span className="mr-1 inline-block h-1 w-6 align-middle" style={{ background: BAND_COLOUR.within }} /> within: under 60 % of the limit
              </li>
              <li>
                <span className="mr-1 inline-block h-1 w-6 align-middle" style={{ background: BAND_COLOUR.caution }} /> caution: 60 to 100 %
              </li>
              <li>
                <span className="mr-1 inline-block h-0 w-6 border-t-2 border-dashed align-middle" style={{ borderColor: BAND_COLOUR.over }} /> ▲ over the limit (dashed)
              </li>
            </ul>
            <p className="mt-1">
              Limits (common practice): {CANVAS_LIMITS.wireDropPercent} % of {doc.systemVoltage} V on a cable, {CANVAS_LIMITS.jointDropV} V across a connection, the cable&rsquo;s derated
              ampacity (33 CFR 183.425 Table 5).
            </p>
            <p className="mt-1">Zoomed far out, the drawing keeps its colours and leaves out the figures; zoom in to read each part&rsquo;s volts and each cable&rsquo;s current and drop.</p>
          </section>
        </aside>
      </div>

      <section className="border-t border-graphite-100 bg-paper-raised px-4 py-3" aria-label="Results">
        <h2 className="text-sm font-semibold">
          Cables and connections, {activeState?.name ?? "base"}: {result ? (result.status === "ok" ? "solved" : "no trustworthy solution") : "solving..."}
        </h2>
        <ResultsTable rows={tableRows} onPick={pickRow} />
      </section>
      {saver.error && !staleVersionOf(saver.error) ? <IssueList error={saver.error} /> : null}
      {addingLoad ? (
        <AddLoadDialog
          doc={doc}
          currentState={stateId}
          onClose={() => setAddingLoad(false)}
          onAdd={(plan) => {
            commit(plan.doc);
            setStateId(plan.stateId);
            setAddingLoad(false);
            setNotice(`Added ${plan.ids.load} with a ${plan.size} feed and a ${plan.fuseA} A fuse; showing the new state.`);
            setTimeout(() => select([plan.ids.load]), 0);
          }}
        />
      ) : null}
      {conflict ? (
        <ConflictDialog
          mine={conflict.mine}
          baseVersion={conflict.baseVersion}
          theirs={conflict.theirs}
          busy={saver.isPending}
          onReload={() => {
            setHistory({ past: [], future: [] });
            base.current = conflict.theirs.version;
            const theirs = withPositions(conflict.theirs.document);
            savedDoc.current = theirs;
            setSavedShown(theirs);
            setDoc(theirs);
            setSave({ kind: "saved", version: conflict.theirs.version });
            setConflict(null);
          }}
          onOverwrite={() => {
            base.current = conflict.theirs.version;
            setConflict(null); // the save effect sends the current document over their version
          }}
        />
      ) : null}
    </div>
  );
}
