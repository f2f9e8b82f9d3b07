import { MATERIALS, STRANDING_FACTOR, type MaterialId } from "./materials";
import type { ConductorSize } from "./sizes";

/** How the caller picks the conductor temperature: the ambient, the insulation's rating (worst case) or a number. */
export type ConductorTempChoice = "ambient" | "rated" | number;

export function conductorTempC(choice: ConductorTempChoice, ambientC: number, insulationRatingC: number): number {
  if (choice === "ambient") return ambientC;
  if (choice === "rated") return insulationRatingC;
  return choice;
}

/** R_T / R_20 = 1 + alpha (T - 20). */
export function temperatureFactor(material: MaterialId, tempC: number): number {
  return 1 + MATERIALS[material].alpha20 * (tempC - 20);
}

/** Resistance of one metre of stranded conductor at tempC, ohm per metre. */
export function resistancePerMetre(size: ConductorSize, material: MaterialId, tempC: number, stranded = true): number {
  const r20 = MATERIALS[material].resistivity20 / size.areaM2;
  return r20 * (stranded ? STRANDING_FACTOR : 1) * temperatureFactor(material, tempC);
}

/** Resistance of a run of lengthM metres at tempC, ohm. */
export function conductorResistanceOhm(size: ConductorSize, material: MaterialId, lengthM: number, tempC: number): number {
  return resistancePerMetre(size, material, tempC) * lengthM;
}
