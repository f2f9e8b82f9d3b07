import { INSULATION_TYPES } from "@/lib/conductors";

/** The cable types the trade names (SAE J1128, J1127, ISO 6722) with their ratings, as a select's options. */
export function InsulationOptions() {
  return (
    <>
      {INSULATION_TYPES.map((t) => (
        <option key={t.id} value={t.id}>
          {t.name} ({t.ratingC} °C)
        </option>
      ))}
    </>
  );
}
