/**
 * A small drawing for the start page: a starting circuit with the positive and ground paths and what a
 * voltmeter across each would read while cranking. Illustrative values, not a measurement.
 */
export function DropIllustration() {
  return (
    <svg viewBox="0 0 360 220" role="img" aria-labelledby="drop-ill-title" className="h-auto w-full">
      <title id="drop-ill-title">
        A battery feeding a starter: 0.18 V lost along the positive cable, 0.62 V lost across a corroded ground strap.
      </title>
      <rect x="0" y="0" width="360" height="220" rx="14" fill="#1d2125" />
      {/* battery */}
      <rect x="28" y="78" width="70" height="62" rx="6" fill="#2a3036" stroke="#68737d" />
      <text x="63" y="114" textAnchor="middle" fill="#e4e7ea" fontSize="13" fontFamily="var(--font-jetbrains-mono)">12.4 V</text>
      <text x="44" y="72" fill="#c26f33" fontSize="16" fontWeight="700">+</text>
      <text x="44" y="160" fill="#aab3bb" fontSize="16" fontWeight="700">−</text>
      {/* starter */}
      <circle cx="290" cy="109" r="34" fill="#2a3036" stroke="#68737d" />
      <text x="290" y="114" textAnchor="middle" fill="#e4e7ea" fontSize="15" fontWeight="600">M</text>
      {/* positive path */}
      <path d="M52 78 V40 H290 V75" fill="none" stroke="#c26f33" strokeWidth="5" strokeLinecap="round" />
      {/* ground path with a bad joint */}
      <path d="M52 140 V182 H170" fill="none" stroke="#aab3bb" strokeWidth="5" strokeLinecap="round" />
      <path d="M200 182 H290 V143" fill="none" stroke="#aab3bb" strokeWidth="5" strokeLinecap="round" />
      <rect x="170" y="172" width="30" height="20" rx="4" fill="#b0301f" />
      {/* readings */}
      <rect x="122" y="16" width="108" height="26" rx="13" fill="#2d7a56" />
      <text x="176" y="34" textAnchor="middle" fill="#fff" fontSize="13" fontFamily="var(--font-jetbrains-mono)">0.18 V drop</text>
      <rect x="128" y="140" width="114" height="26" rx="13" fill="#b0301f" />
      <text x="185" y="158" textAnchor="middle" fill="#fff" fontSize="13" fontFamily="var(--font-jetbrains-mono)">0.62 V drop</text>
      <text x="185" y="212" textAnchor="middle" fill="#aab3bb" fontSize="11">ground strap, engine to frame</text>
    </svg>
  );
}
