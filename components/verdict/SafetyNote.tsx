/**
 * The standing cautions of the trade, shown wherever a verdict leads to action.
 * `full` lists them; the short form keeps only the line about judgement.
 */
export const STANDING_CAUTIONS = [
  "Never energise a compressor while the system is in deep vacuum.",
  "Nitrogen only through a regulator, and never above the system’s lowest rated test pressure.",
  "Follow the equipment maker’s instructions and local codes; handle refrigerant only with the certification the law asks for.",
] as const;

export const JUDGEMENT_LINE = "Riseline supports your judgement; it does not replace the manufacturer’s procedure.";

/**
 * `testCautions`: the cautions of this test's findings, gathered into the one safety box (listed
 * first, each once) so the page never shows several boxes saying similar things.
 */
export function SafetyNote({ full = false, className = "", testCautions = [] }: { full?: boolean; className?: string; testCautions?: readonly string[] }) {
  const forThisTest = [...new Set(testCautions)].filter((c) => !(STANDING_CAUTIONS as readonly string[]).includes(c));
  return (
    <aside aria-label="Safety" data-testid="safety-note" className={`rounded-card border-2 border-flare-500 bg-flare-100 px-4 py-3 text-ink dark:bg-surface-raised dark:text-fg ${className}`}>
      <p className="flex items-center gap-2 font-semibold">
        <span aria-hidden="true" className="inline-flex h-6 w-6 items-center justify-center rounded-full bg-flare-500 text-caption font-bold text-ink">!</span>
        {full ? "Safety first" : JUDGEMENT_LINE}
      </p>
      {full && (
        <>
          {forThisTest.length > 0 && (
            <>
              <p className="mt-2 text-body font-semibold">For this test</p>
              <ul className="list-disc space-y-1 pl-6 text-body" data-testid="safety-test-cautions">
                {forThisTest.map((c) => <li key={c}>{c}</li>)}
              </ul>
              <p className="mt-2 text-body font-semibold">Always</p>
            </>
          )}
          <ul className="mt-2 list-disc space-y-1 pl-6 text-body">
            {STANDING_CAUTIONS.map((c) => <li key={c}>{c}</li>)}
          </ul>
          <p className="mt-2 text-body font-medium">{JUDGEMENT_LINE}</p>
        </>
      )}
    </aside>
  );
}
