import type { ComponentKind } from "@/lib/circuit";

/**
 * Ampwright's own drawings of the parts, in the spirit of the IEC 60617 graphical symbols (cells for a battery, a
 * circle with G or M for a generator or motor, a box for a resistive load, a box with a line for a fuse).
 * 64 x 40 units, stroke in the current colour.
 */
export function Symbol({ kind, className }: { kind: ComponentKind; className?: string }) {
  const common = { fill: "none", stroke: "currentColor", strokeWidth: 2, strokeLinecap: "round" as const };
  return (
    <svg viewBox="0 0 64 40" className={className} aria-hidden="true">
      {kind === "battery" ? (
        <g {...common}>
          <path d="M2 20h16M46 20h16" />
          <path d="M18 8v24M24 14v12M36 8v24M42 14v12" />
          <path d="M27 20h6" strokeDasharray="2 2" />
          <text x="10" y="12" fontSize="9" fill="currentColor" stroke="none">+</text>
        </g>
      ) : kind === "alternator" || kind === "starter" ? (
        <g {...common}>
          <path d="M2 20h16M46 20h16" />
          <circle cx="32" cy="20" r="14" />
          <text x="32" y="25" fontSize="14" textAnchor="middle" fill="currentColor" stroke="none" fontWeight="600">
            {kind === "alternator" ? "G" : "M"}
          </text>
          {kind === "alternator" ? <path d="M26 31q3-3 6 0t6 0" strokeWidth={1.5} /> : null}
        </g>
      ) : kind === "load" ? (
        <g {...common}>
          <path d="M2 20h14M48 20h14" />
          <rect x="16" y="11" width="32" height="18" rx="1" />
        </g>
      ) : kind === "fuse" ? (
        <g {...common}>
          <path d="M2 20h14M48 20h14" />
          <rect x="16" y="13" width="32" height="14" rx="1" />
          <path d="M16 20h32" strokeWidth={1.5} />
        </g>
      ) : kind === "switch" ? (
        <g {...common}>
          <path d="M2 20h18M44 20h18M20 20l22-11" />
          <circle cx="20" cy="20" r="2" fill="currentColor" />
          <circle cx="44" cy="20" r="2" fill="currentColor" />
        </g>
      ) : kind === "joint" ? (
        <g {...common}>
          <path d="M2 20h20M42 20h20" />
          <rect x="22" y="15" width="20" height="10" rx="1" />
          <circle cx="22" cy="20" r="2.5" fill="currentColor" />
          <circle cx="42" cy="20" r="2.5" fill="currentColor" />
        </g>
      ) : kind === "junction" ? (
        <g {...common}>
          <path d="M14 20h36" strokeWidth={5} />
          <circle cx="32" cy="20" r="4" fill="currentColor" />
        </g>
      ) : (
        <g {...common}>
          <path d="M32 2v18M18 20h28M23 27h18M28 34h8" />
        </g>
      )}
    </svg>
  );
}
