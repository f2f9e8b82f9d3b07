/**
 * Automotive cable types by the names the SAE and ISO cable standards give them, with temperature ratings.
 * Ratings are from memory of SAE J1128 (low-voltage primary cable), SAE J1127 (battery cable) and ISO 6722-1
 * (temperature classes); check the cable maker's data sheet for the cable in hand.
 */
export type InsulationType = {
  id: string;
  name: string;
  standard: string;
  ratingC: number;
};

export const INSULATION_TYPES: InsulationType[] = [
  { id: "GPT", name: "GPT: general-purpose PVC", standard: "SAE J1128", ratingC: 80 },
  { id: "HDT", name: "HDT: heavy-wall PVC", standard: "SAE J1128", ratingC: 80 },
  { id: "TWP", name: "TWP: thin-wall PVC", standard: "SAE J1128", ratingC: 105 },
  { id: "GXL", name: "GXL: cross-linked, standard wall", standard: "SAE J1128", ratingC: 125 },
  { id: "TXL", name: "TXL: cross-linked, thin wall", standard: "SAE J1128", ratingC: 125 },
  { id: "SXL", name: "SXL: cross-linked, heavy wall", standard: "SAE J1128", ratingC: 125 },
  { id: "SGT", name: "SGT: battery cable, PVC", standard: "SAE J1127", ratingC: 80 },
  { id: "SGX", name: "SGX: battery cable, cross-linked", standard: "SAE J1127", ratingC: 125 },
  { id: "STX", name: "STX: battery cable, cross-linked thin wall", standard: "SAE J1127", ratingC: 125 },
  { id: "ISO-A", name: "ISO 6722 class A", standard: "ISO 6722-1", ratingC: 85 },
  { id: "ISO-B", name: "ISO 6722 class B", standard: "ISO 6722-1", ratingC: 100 },
  { id: "ISO-C", name: "ISO 6722 class C", standard: "ISO 6722-1", ratingC: 125 },
  { id: "ISO-D", name: "ISO 6722 class D", standard: "ISO 6722-1", ratingC: 150 },
];

/** A type by id, or "rated N C" for anything else. */
export function insulationRating(idOrText: string): number | undefined {
  const t = INSULATION_TYPES.find((i) => i.id.toLowerCase() === idOrText.trim().toLowerCase());
  if (t) return t.ratingC;
  const m = /^rated\s+(\d+(?:\.\d+)?)\s*(?:°?\s*c)?$/i.exec(idOrText.trim());
  return m ? Number(m[1]) : undefined;
}
