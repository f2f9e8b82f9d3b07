import { MATERIALS, STRANDING_FACTOR, type MaterialId } from "./materials";
import { findSize, type ConductorSize } from "./sizes";

/**
 * 33 CFR 183.425 Table 5: allowable amperes of conductors (a single conductor in free air), by AWG size and
 * insulation temperature rating, at 30 degrees C ambient. US federal regulation for boats; the same figures as
 * the marine standard ABYC E-11.
 */
export const TABLE5_RATINGS_C = [60, 75, 80, 90, 105, 125, 200] as const;
export const TABLE5_BASIS_C = 30;
export const TABLE5: Record<string, readonly number[]> = {
  "18 AWG": [10, 10, 15, 20, 20, 25, 25],
  "16 AWG": [15, 15, 20, 25, 25, 30, 35],
  "14 AWG": [20, 20, 25, 30, 35, 40, 45],
  "12 AWG": [25, 25, 35, 40, 45, 50, 55],
  "10 AWG": [40, 40, 50, 55, 60, 70, 70],
  "8 AWG": [55, 65, 70, 70, 80, 90, 100],
  "6 AWG": [80, 95, 100, 100, 120, 125, 135],
  "4 AWG": [105, 125, 130, 135, 160, 170, 180],
  "2 AWG": [140, 170, 175, 180, 210, 225, 240],
  "1 AWG": [165, 195, 210, 210, 245, 265, 280],
  "1/0 AWG": [195, 230, 245, 245, 285, 305, 325],
  "2/0 AWG": [225, 265, 285, 285, 330, 355, 370],
  "3/0 AWG": [260, 310, 330, 330, 385, 410, 430],
  "4/0 AWG": [300, 360, 385, 385, 445, 475, 510],
};

export type TableAmpacity = {
  /** Allowable amperes at the table's 30 degrees C basis. */
  amps: number;
  /** The insulation column used (the highest listed rating not above the cable's). */
  columnC: number;
  /** True when the size is not a row of the table and the value was interpolated. */
  derived: boolean;
  /** True when the insulation rating fell between columns and the lower column was taken. */
  lowerColumn: boolean;
};

const ROWS = Object.keys(TABLE5).map((label) => findSize(label) as ConductorSize);

/**
 * The table's ampacity for any size and rating. A rating between columns takes the lower column; a size the
 * table does not list is interpolated (or, outside the table, extrapolated from the two nearest rows)
 * log-log in circular mils, and marked derived. Returns undefined below the table's lowest column (60 C).
 */
export function tableAmpacity(size: ConductorSize, insulationRatingC: number): TableAmpacity | undefined {
  let col = -1;
  for (let i = 0; i < TABLE5_RATINGS_C.length; i++) if (TABLE5_RATINGS_C[i] <= insulationRatingC) col = i;
  if (col < 0) return undefined;
  const columnC = TABLE5_RATINGS_C[col];
  const lowerColumn = columnC !== insulationRatingC;
  const row = TABLE5[size.label];
  if (row) return { amps: row[col], columnC, derived: false, lowerColumn };
  // Neighbouring rows by area.
  let hi = ROWS.findIndex((r) => r.cmil > size.cmil);
  if (hi <= 0) hi = hi === 0 ? 1 : ROWS.length - 1;
  const a = ROWS[hi - 1];
  const b = ROWS[hi];
  const ia = TABLE5[a.label][col];
  const ib = TABLE5[b.label][col];
  const t = (Math.log(size.cmil) - Math.log(a.cmil)) / (Math.log(b.cmil) - Math.log(a.cmil));
  const amps = Math.exp(Math.log(ia) + t * (Math.log(ib) - Math.log(ia)));
  return { amps: Math.round(amps * 10) / 10, columnC, derived: true, lowerColumn };
}

/** Default ambient of a routing zone, used only when no ambient is given. */
export const ZONE_AMBIENT_C = { cabin: 30, underbody: 40, engine: 50 } as const;
export type Zone = keyof typeof ZONE_AMBIENT_C;

/**
 * Ambient correction, the square-root rule of NFPA 70 310.15(B)(1): I' = I sqrt((Tc - Ta) / (Tc - 30)); 0 at or
 * above the insulation rating. Never above 1: Table 5 prints no correction for ambients below its 30 C basis, so no
 * credit is taken for the cold (a cable routed in winter also runs in summer).
 */
export function ambientFactor(insulationRatingC: number, ambientC: number): number {
  return Math.min(1, squareRootRule(insulationRatingC, ambientC));
}

/** The square-root rule itself, I'/I = sqrt((Tc - Ta) / (Tc - 30)), uncapped (NFPA 70 prints it above 1 below 30 C). */
export function squareRootRule(insulationRatingC: number, ambientC: number): number {
  if (ambientC >= insulationRatingC) return 0;
  return Math.sqrt((insulationRatingC - ambientC) / (insulationRatingC - TABLE5_BASIS_C));
}

/** Marine practice bundling factors (USCG electrical compliance guideline): 3: 0.70, 4-6: 0.60, 7-24: 0.50, 25+: 0.40. */
export function bundleFactor(conductorsInBundle: number): number {
  if (conductorsInBundle >= 25) return 0.4;
  if (conductorsInBundle >= 7) return 0.5;
  if (conductorsInBundle >= 4) return 0.6;
  if (conductorsInBundle >= 3) return 0.7;
  return 1;
}

export type DeratedAmpacity = TableAmpacity & { ambientFactor: number; bundleFactor: number; materialFactor: number; ampacityA: number };

/** Table ampacity (copper) corrected for ambient, bundling and the conductor's material (equal heating). */
export function deratedAmpacity(
  size: ConductorSize,
  insulationRatingC: number,
  ambientC: number,
  bundleSize: number,
  material: MaterialId = "copper",
  basis: AmpacityBasis = "marine-table",
): DeratedAmpacity | undefined {
  if (basis === "heat-balance") {
    // The heat balance works at the real ambient and material itself: no table factors but the bundle's.
    const amps = heatBalanceAmpacity(size, material, insulationRatingC, ambientC);
    const bf = bundleFactor(bundleSize);
    return { amps, columnC: insulationRatingC, derived: false, lowerColumn: false, ambientFactor: 1, bundleFactor: bf, materialFactor: 1, ampacityA: amps * bf };
  }
  const base = tableAmpacity(size, insulationRatingC);
  if (!base) return undefined;
  const af = ambientFactor(base.columnC, ambientC);
  const bf = bundleFactor(bundleSize);
  const mf = MATERIALS[material].ampacityFactor;
  return { ...base, ambientFactor: af, bundleFactor: bf, materialFactor: mf, ampacityA: base.amps * af * bf * mf };
}

/** The bases an ampacity can come from: the marine table, or a heat balance of the cable in still air. */
export type AmpacityBasis = "marine-table" | "heat-balance";

/**
 * Parameters of the heat balance, each a representative engineering figure (from memory; the cable maker's data
 * decides for a given cable): natural convection from a horizontal cylinder in still air, h = 1.32 (dT / D)^0.25
 * W/m2K (the simplified laminar correlation of heat-transfer handbooks); radiation with emissivity 0.9 (PVC and
 * cross-linked polyolefin jackets); insulation thermal conductivity 0.2 W/mK; and a thin automotive wall of
 * 0.2 mm + 10 % of the conductor's diameter (close to the ISO 6722-1 thin-wall and SAE J1128 TXL outer diameters).
 */
export const HEAT_BALANCE = { convection: 1.32, emissivity: 0.9, insulationW_mK: 0.2, wallBaseM: 0.0002, wallFraction: 0.1 } as const;
const SIGMA = 5.670374419e-8; // Stefan-Boltzmann constant, W/m2K4 (CODATA 2018)

/**
 * The current at which a cable alone in still air at ambientC settles with its conductor at the insulation's rating:
 * I^2 R'(Tc) = (Tc - Ta) / (R_insulation + 1 / (h pi D)), with R' at the conductor temperature. A basis for road
 * vehicles, whose cables are rated by temperature class (ISO 6722-1 classes A to D, SAE J1128), not by a table.
 */
export function heatBalanceAmpacity(size: ConductorSize, material: MaterialId, insulationRatingC: number, ambientC: number): number {
  if (ambientC >= insulationRatingC) return 0;
  const m = MATERIALS[material];
  const dc = Math.sqrt((4 * size.areaM2) / Math.PI);
  const dout = dc + 2 * (HEAT_BALANCE.wallBaseM + HEAT_BALANCE.wallFraction * dc);
  const rPerM = (m.resistivity20 / size.areaM2) * STRANDING_FACTOR * (1 + m.alpha20 * (insulationRatingC - 20));
  const rIns = Math.log(dout / dc) / (2 * Math.PI * HEAT_BALANCE.insulationW_mK);
  // The surface sits between the conductor and the air: find it by fixed-point iteration on the heat flow.
  let ts = (insulationRatingC + ambientC) / 2;
  let q = 0;
  for (let i = 0; i < 60; i++) {
    const dT = Math.max(1e-6, ts - ambientC);
    const hConv = HEAT_BALANCE.convection * (dT / dout) ** 0.25;
    const tsK = ts + 273.15;
    const taK = ambientC + 273.15;
    const hRad = HEAT_BALANCE.emissivity * SIGMA * (tsK * tsK + taK * taK) * (tsK + taK);
    const rAir = 1 / ((hConv + hRad) * Math.PI * dout);
    q = (insulationRatingC - ambientC) / (rIns + rAir);
    const next = ambientC + q * rAir;
    if (Math.abs(next - ts) < 1e-9) break;
    ts = next;
  }
  return Math.sqrt(q / rPerM);
}
