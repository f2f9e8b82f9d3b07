/** Dates and numbers as the screens show them; one place so every page reads the same. */
const dateTime = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", year: "numeric", hour: "2-digit", minute: "2-digit", timeZone: "UTC" });
const dateOnly = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", year: "numeric", timeZone: "UTC" });

/** "2 Dec 2026, 09:30 UTC": the same on the server and in the browser. */
export function formatWhen(iso: string | Date): string {
  return `${dateTime.format(new Date(iso))} UTC`;
}

export function formatDay(iso: string | Date): string {
  return dateOnly.format(new Date(iso));
}

/** A measured or computed voltage with its unit, in the unit it was read in. */
export function formatVolts(value: number, unit: "V" | "mV" = "V"): string {
  return unit === "mV" ? `${value.toLocaleString("en-GB", { maximumFractionDigits: 1 })} mV` : `${value.toLocaleString("en-GB", { maximumFractionDigits: 3 })} V`;
}

export const STATUS_LABELS = { open: "Open", diagnosed: "Diagnosed", repaired: "Repaired", closed: "Closed" } as const;
