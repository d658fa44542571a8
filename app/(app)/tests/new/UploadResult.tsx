"use client";

import { useEffect, useRef } from "react";
import { useQuery } from "@tanstack/react-query";
import { LazyDecayChart } from "@/components/curve/LazyDecayChart";
import { VerdictBanner } from "@/components/verdict/VerdictBanner";
import { SafetyNote } from "@/components/verdict/SafetyNote";
import { verdictText } from "@/components/verdict/words";
import { Alert, Button, LinkButton } from "@/components/ui";
import { getTest, type CreatedTest } from "@/lib/client/api";

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
  const detail = useQuery({ queryKey: ["test", id], queryFn: ({ signal }) => getTest(id, signal) });

  useEffect(() => {
    ref.current?.scrollIntoView({ block: "start" });
  }, []);

  return (
    <div ref={ref} className="scroll-mt-16 space-y-4" data-testid="upload-result">
      <p className="text-body text-fg-soft" role="status">
        <span className="sr-only">Analysed. Verdict: {verdictText(created.analysis.verdict).headline}. </span>
        Saved as <span className="font-semibold text-fg">{created.test.title}</span>
      </p>
      <VerdictBanner analysis={created.analysis} />
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
        <LinkButton href={`/tests/${id}`} size="lg" block>Open the test page</LinkButton>
        <Button variant="secondary" size="lg" block onClick={onAnother}>Start another test</Button>
      </div>
    </div>
  );
}
