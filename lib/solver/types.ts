export type Severity = "error" | "warning";

export type SolveIssueCode =
  | "unknown-state"
  | "unknown-component"
  | "invalid-state-override"
  | "duplicate-id"
  | "unknown-terminal"
  | "unconnected"
  | "floating-section"
  | "no-return-path"
  | "ideal-source-loop"
  | "dead-short"
  | "multiple-references"
  | "supply-collapse"
  | "non-convergence"
  | "fuse-overload"
  | "numeric-failure";

export type SolveIssue = { severity: Severity; code: SolveIssueCode; message: string; ids: string[] };

export type ComponentResult = { current?: number; voltage: number; power?: number; mode?: string };
export type WireResult = { current: number; resistance: number; drop: number; dropPercent: number; power: number };

export type SolveResult = {
  status: "ok" | "error";
  state: string;
  converged: boolean;
  /** Newton iterations, summed over the active-set passes. */
  iterations: number;
  /** Alternator mode passes (1 when nothing had to switch). */
  activeSetPasses: number;
  /** The terminal held at 0 V. */
  reference: string | null;
  terminals: Record<string, number>;
  components: Record<string, ComponentResult>;
  wires: Record<string, WireResult>;
  issues: SolveIssue[];
};

export type SolveOptions = {
  /** The operating state to solve ("base" is the document as written). */
  state: string;
  /** A constant-power load behaves as a constant resistance below this fraction of the system voltage. */
  powerMinVoltageFraction: number;
  /** Newton stops when no node moves by more than this many volts. */
  voltageTolerance: number;
  maxNewtonIterations: number;
  /** Current tolerance (A) for switching alternator modes. */
  modeToleranceA: number;
};

export const defaultOptions: SolveOptions = {
  state: "base",
  powerMinVoltageFraction: 0.5,
  voltageTolerance: 1e-10,
  maxNewtonIterations: 60,
  modeToleranceA: 1e-9,
};
