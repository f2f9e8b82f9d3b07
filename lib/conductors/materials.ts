/** Conductor materials: resistivity at 20 degrees C and the temperature coefficient alpha at 20 degrees C. */

export type MaterialId = "copper" | "tinned-copper" | "aluminium" | "cca";

export type Material = {
  id: MaterialId;
  name: string;
  /** Resistivity at 20 degrees C, ohm metre. */
  resistivity20: number;
  /** Temperature coefficient of resistance at 20 degrees C, per kelvin. */
  alpha20: number;
  source: string;
  /**
   * Ampacity as a fraction of copper's for the same size: equal heating per metre (I^2 R) gives sqrt(rho_Cu / rho).
   * Cross-check: NFPA 70 Table 310.16 prints 2 AWG at 75 C as 115 A copper and 90 A aluminium, 0.78 (from memory).
   */
  ampacityFactor: number;
};

const equalHeating = (resistivity20: number) => Math.sqrt(1.7241e-8 / resistivity20);

const DEFINED: Record<MaterialId, Omit<Material, "ampacityFactor">> = {
  copper: {
    id: "copper",
    name: "Copper (annealed)",
    resistivity20: 1.7241e-8,
    alpha20: 0.00393,
    source: "IEC 60028 international annealed copper standard; NBS Handbook 100",
  },
  "tinned-copper": {
    id: "tinned-copper",
    name: "Tinned copper",
    // Tin coating adds roughly 2 % to a stranded conductor's resistance (from memory; compare IEC 60228's
    // separate, slightly higher maxima for metal-coated class 5 conductors).
    resistivity20: 1.7241e-8 * 1.02,
    alpha20: 0.00393,
    source: "copper plus about 2 % for the tin coating (from memory; IEC 60228 lists metal-coated maxima a few per cent higher)",
  },
  aluminium: {
    id: "aluminium",
    name: "Aluminium (61 % IACS)",
    resistivity20: 2.8264e-8,
    alpha20: 0.00403,
    source: "engineering handbooks, 61 % IACS electrical-grade aluminium (from memory)",
  },
  cca: {
    id: "cca",
    name: "Copper-clad aluminium (10 % copper by volume)",
    // About 62-64 % IACS for 10 % clad wire (from memory, ASTM B566 class 10A).
    resistivity20: 1.7241e-8 / 0.63,
    alpha20: 0.00403,
    source: "ASTM B566 class 10A, about 63 % IACS (from memory)",
  },
};

export const MATERIALS = Object.fromEntries(
  Object.entries(DEFINED).map(([id, m]) => [id, { ...m, ampacityFactor: id === "copper" ? 1 : equalHeating(m.resistivity20) }]),
) as Record<MaterialId, Material>;

export const MATERIAL_IDS = Object.keys(MATERIALS) as MaterialId[];

/**
 * Ratio of a stranded conductor's resistance to a solid one of the same nominal area: 1.02, the lay-length
 * allowance of concentric stranding (ASTM B8 "2 percent increment"; the ratio of stranded to solid values in
 * NFPA 70 Chapter 9 Table 8 is 1.02 to 1.03; from memory).
 */
export const STRANDING_FACTOR = 1.02;
