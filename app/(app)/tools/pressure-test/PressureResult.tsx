"use client";

/**
 * The worked-out result of a nitrogen test, warning first: a reading above the rated test
 * pressure stands at the very top, before the verdict, and the verdict then says "Stopped".
 */
import type { NitrogenResult } from "@/analysis/calculators/nitrogen";
import { durationWords } from "@/analysis/shared/format";
import { Alert, Badge, Card } from "@/components/ui";
import { VERDICT_TONE, VERDICT_WORDS } from "./words";

function Steps({ result }: { result: NitrogenResult }) {
  return (
    <ol className="space-y-1 text-body" aria-label="The correction worked out">
      {result.steps.map((s) => (
        <li key={s.key} className="flex flex-wrap justify-between gap-x-3 border-b border-surface-line py-1">
          <span className="text-fg-soft">{s.label}</span>
          <span className="font-mono text-caption sm:text-body">
            {s.expression} = <strong>{s.value.toFixed(s.displayDigits)}</strong> {s.unit}
          </span>
        </li>
      ))}
    </ol>
  );
}

export function PressureResult({ result, saved, assumptions }: { result: NitrogenResult; saved: boolean; assumptions: string[] }) {
  const over = result.warnings.find((w) => w.code === "above_rated_pressure");
  const others = result.warnings.filter((w) => w.code !== "above_rated_pressure");
  const gaugeUnit = result.steps.find((s) => s.key === "p2_gauge")?.unit;
  const rate = result.steps.find((s) => s.key === "rate_per_hour");
  return (
    <Card title={saved ? "Saved" : "Result"} data-testid="pressure-result">
      {over && (
        <Alert tone="error" title="Stopped: above the rated test pressure" className="mb-3">
          <span data-testid="over-pressure-warning">{over.message}</span>
        </Alert>
      )}
      {others.map((w) => (
        <Alert key={w.code} tone="warning" className="mb-3">
          {w.message}
        </Alert>
      ))}
      <div className="flex flex-wrap items-center gap-3">
        <span data-testid="pressure-verdict">
          <Badge tone={VERDICT_TONE[result.verdict]} className="text-body whitespace-normal">
            {VERDICT_WORDS[result.verdict]}
          </Badge>
        </span>
        {!over && (
          <span className="text-body">
            Expected end <strong data-testid="expected-end">{result.expectedEndGauge.toFixed(2)}</strong> {gaugeUnit}
          </span>
        )}
      </div>
      <p className="mt-2 text-body">{result.summary}</p>
      <p className="mt-1 text-body text-fg-soft">
        Highest reading <strong data-testid="highest-reading">{result.highest.pressureGauge.toFixed(1)}</strong> {gaugeUnit}
        {result.highest.atSeconds !== null && result.highest.which !== "start" ? ` at ${durationWords(result.highest.atSeconds)}` : result.highest.which === "start" ? " at the start" : ""}
        {result.durationSeconds ? ` · test ran ${durationWords(result.durationSeconds)}` : ""}
        {rate ? ` · ${rate.value.toFixed(2)} ${rate.unit} after temperature correction` : ""}
      </p>
      <details className="mt-3" open={!over}>
        <summary className="min-h-tap cursor-pointer py-2 font-medium">
          {over ? "The temperature correction, for the record" : "The correction worked out"}
        </summary>
        <Steps result={result} />
      </details>
      {assumptions.map((a) => (
        <p key={a} className="mt-2 text-caption text-fg-soft">
          {a}
        </p>
      ))}
    </Card>
  );
}
