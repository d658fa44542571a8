"use client";

import { useEffect, useRef, useState } from "react";
import type { AnalysisResult, UnsureReason } from "@/analysis/decay/types";
import { useQuery } from "@tanstack/react-query";
import { LazyDecayChart } from "@/components/curve/LazyDecayChart";
import { VerdictBanner } from "@/components/verdict/VerdictBanner";
import { SafetyNote } from "@/components/verdict/SafetyNote";
import { verdictText } from "@/components/verdict/words";
import { Alert, Button, LinkButton } from "@/components/ui";
import { getTest, newIdempotencyKey, reanalyse, type CreatedTest } from "@/lib/client/api";

/** An apprentice's practice test: saved; the verdict shows after their own call. */
function PracticeSaved({ title, callUrl, onAnother }: { title: string; callUrl: string; onAnother: () => void }) {
  return (
    <div className="space-y-4" data-testid="upload-result">
      <p className="text-body text-fg-soft" role="status">
        Saved as <span className="font-semibold text-fg">{title}</span>
      </p>
      <Alert tone="info" title="Practice test saved">
        Make your own call on this curve first; the verdict shows once you have.
      </Alert>
      <div className="flex flex-col gap-3 sm:flex-row">
        <LinkButton href={callUrl} size="lg" block>Make your call</LinkButton>
        <Button variant="secondary" size="lg" block onClick={onAnother}>Start another test</Button>
      </div>
    </div>
  );
}

/** The verdict as soon as the server answers, then the curve (chart.js loads only now). */
export function UploadResult({ created, onAnother }: { created: CreatedTest; onAnother: () => void }) {
  if (created.analysis === null) return <PracticeSaved title={created.test.title} callUrl={created.practiceCallUrl} onAnother={onAnother} />;
  return <VerdictResult created={created} onAnother={onAnother} />;
}

function VerdictResult({ created, onAnother }: { created: Extract<CreatedTest, { analysis: object }>; onAnother: () => void }) {
  const ref = useRef<HTMLDivElement | null>(null);
  const id = created.test.id;
  const [analysis, setAnalysis] = useState<AnalysisResult>(created.analysis);
  // the whole file left the thousands separator or decimal mark open (the preview's first rows had decided it)
  const decimalDoubt = analysis.import.unsureReasons?.find((r) => r.code === "decimal_mark" && r.choices?.length === 2) ?? null;
  const detail = useQuery({ queryKey: ["test", id, analysis.import.decimalComma], queryFn: ({ signal }) => getTest(id, signal) });

  useEffect(() => {
    ref.current?.scrollIntoView({ block: "start" });
  }, []);

  return (
    <div ref={ref} className="scroll-mt-16 space-y-4" data-testid="upload-result">
      <p className="text-body text-fg-soft" role="status">
        <span className="sr-only">Analysed. Verdict: {verdictText(created.analysis.verdict).headline}. </span>
        Saved as <span className="font-semibold text-fg">{created.test.title}</span>
      </p>
      {decimalDoubt && <DecimalDoubt testId={id} reason={decimalDoubt} onRead={setAnalysis} />}
      <VerdictBanner analysis={analysis} />
      {detail.data ? (
        <LazyDecayChart analysis={detail.data.analysis} series={detail.data.series} />
      ) : detail.isError ? (
        <Alert tone="warning" title="The curve could not be loaded">
          The test is saved. Open the test page to see the curve.
        </Alert>
      ) : (
        <div className="flex h-72 items-center justify-center rounded-card border border-surface-line bg-surface-raised text-fg-soft" role="status">
          Loading the curve…
        </div>
      )}
      <SafetyNote />
      <div className="flex flex-col gap-3 sm:flex-row">
        <LinkButton href={`/vacuum-tests/${id}`} size="lg" block>Open the test page</LinkButton>
        <Button variant="secondary" size="lg" block onClick={onAnother}>Start another test</Button>
      </div>
    </div>
  );
}

/**
 * The whole file left "4,150" open (4,150 or 4.15). The verdict below reads the larger value, which
 * cannot pass a wet or leaking system; the technician checks the gauge and, if it showed the smaller,
 * has the test analysed again that way (a new analysis version; the file is never changed).
 */
function DecimalDoubt({ testId, reason, onRead }: { testId: string; reason: UnsureReason; onRead: (a: AnalysisResult) => void }) {
  const [state, setState] = useState<"ask" | "busy" | "failed">("ask");
  const other = reason.choices![1];
  return (
    <Alert tone="warning" title="Check how the readings are written">
      <p data-testid="decimal-doubt">{reason.message}</p>
      <div className="mt-2 flex flex-col gap-2 sm:flex-row">
        <Button
          busy={state === "busy"}
          onClick={async () => {
            setState("busy");
            try {
              const r = await reanalyse(testId, { decimalMark: other.decimalMark, reason: `'${other.cell}' read as ${other.reads}, as the gauge showed` }, newIdempotencyKey());
              onRead(r.analysis);
            } catch {
              setState("failed");
            }
          }}
        >
          The gauge showed {other.reads}: read it that way
        </Button>
      </div>
      {state === "failed" && <p className="mt-1">That did not go through; open the test page and try again.</p>}
    </Alert>
  );
}
