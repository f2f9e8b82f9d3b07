/** The usual cautions for work on batteries and cables, shown wherever a screen sends someone to the vehicle. */
export function SafetyNote({ compact = false, title, items }: { compact?: boolean; title?: string; items?: string[] }) {
  return (
    <aside
      role="note"
      aria-label="Safety"
      className="rounded-lg border border-caution/40 bg-caution-soft p-4 text-sm text-graphite-900"
      data-testid="safety-note"
    >
      <p className="font-semibold">{title ?? "Before you put a meter on it"}</p>
      <ul className={`mt-2 list-disc space-y-1 pl-5 ${compact ? "sm:columns-2 sm:gap-8" : ""}`}>
        {items?.map((i) => (
          <li key={i}>{i}</li>
        ))}
        <li>Lead-acid batteries vent hydrogen: no sparks or flames near them, and wear eye protection.</li>
        <li>Disconnect the negative cable first and reconnect it last. Take off rings and watches.</li>
        <li>A battery short circuit can weld a tool and burn skin. Cables and exhausts get hot; belts and fans move.</li>
        <li>Hybrid and electric high-voltage systems need training and are outside Ampwright&rsquo;s scope.</li>
      </ul>
    </aside>
  );
}
