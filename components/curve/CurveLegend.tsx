/** The chart's key, in HTML so it wraps on a phone and reads with a screen reader. */
export function CurveLegend({ hasFit, hasBand, hasIsolation }: { hasFit: boolean; hasBand: boolean; hasIsolation: boolean }) {
  const item = (swatch: React.ReactNode, text: string) => (
    <li className="flex items-center gap-2">
      {swatch}
      <span>{text}</span>
    </li>
  );
  const stroke = (cls: string, dash?: string) => (
    <svg width="28" height="10" aria-hidden="true" className={cls}>
      <line x1="1" y1="5" x2="27" y2="5" stroke="currentColor" strokeWidth="3" strokeDasharray={dash} />
    </svg>
  );
  return (
    <ul className="mt-2 flex flex-wrap gap-x-4 gap-y-1 px-1 text-caption text-fg-soft" aria-label="Chart key">
      {item(stroke("text-tide-600 dark:text-tide-300"), "Reading")}
      {hasFit && item(stroke("text-ink dark:text-white"), "Fitted hold")}
      {hasBand && item(<span aria-hidden="true" className="inline-block h-3 w-7 rounded-sm bg-flare-500/25 ring-1 ring-flare-700/50" />, "Forecast (95 %)")}
      {item(stroke("text-verdict-leak dark:text-[#fb8a5c]", "6 4"), "Limit")}
      {item(stroke("text-verdict-pass dark:text-[#5fd39a]", "2 3"), "Target")}
      {hasIsolation && item(<svg width="14" height="16" aria-hidden="true" className="text-fg-soft"><line x1="7" y1="1" x2="7" y2="15" stroke="currentColor" strokeWidth="2" strokeDasharray="4 3" /></svg>, "Isolated")}
    </ul>
  );
}
