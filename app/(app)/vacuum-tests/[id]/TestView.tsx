"use client";

import { useMemo, useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { useSearchParams } from "next/navigation";
import { LazyDecayChart } from "@/components/curve/LazyDecayChart";
import { VerdictBanner } from "@/components/verdict/VerdictBanner";
import { SafetyNote } from "@/components/verdict/SafetyNote";
import { Alert, Button, Card, LinkButton, Spinner } from "@/components/ui";
import { ApiError } from "@/lib/client/api";
import { FindingsList } from "./FindingsList";
import { HistoryList } from "./HistoryList";
import { NumbersPanel } from "./NumbersPanel";
import { RawDownload } from "./RawDownload";
import { ReanalyseForm } from "./ReanalyseForm";
import { STATUS_WORDS, dateTimeWords } from "./format";
import { ImportPanel } from "./ImportPanel";
import { TestReviewSection } from "@/components/review";
import { getComments, reviewKeys } from "@/components/review/api";
import { RigForTest } from "@/components/planner/RigForTest";
import { PlanCompare } from "./PlanCompare";
import { useTestDetail } from "@/lib/client/queries";
import { versionHref } from "./version";
import { VersionBanner } from "./VersionBanner";
import { CustomerNote } from "./CustomerNote";
import { NextStep } from "./NextStep";
import { TrainerShortcuts } from "./TrainerShortcuts";
import { ChartTapModePicker, type ChartTapMode } from "./ChartTapMode";

/** The test page: verdict, curve, numbers, forecast, findings, re-analysis and history. */
export function TestView({ id, canReanalyse, canShare, canCurate = false, userId }: { id: string; canReanalyse: boolean; canShare: boolean; canCurate?: boolean; userId?: string }) {
  // ?analysis=<id> shows an earlier analysis version (from the history); none shows the current one.
  const analysisId = useSearchParams()?.get("analysis") || null;
  const q = useTestDetail(id, analysisId);
  const comments = useQuery({ queryKey: reviewKeys.comments(id), queryFn: ({ signal }) => getComments(id, signal) });
  // A tap does one named thing: a comment's minute and the isolation for "Analyse again" are kept apart.
  const [tapMode, setTapMode] = useState<ChartTapMode>("comment");
  const [commentAt, setCommentAt] = useState<number | null>(null);
  const [picked, setPicked] = useState<number | null>(null);
  const [shown, setShown] = useState<number | null>(null);
  const markers = useMemo(
    () => (comments.data?.comments ?? []).filter((c) => c.atSeconds != null).map((c) => ({ seconds: c.atSeconds!, label: c.body })),
    [comments.data],
  );

  if (q.isPending)
    return (
      <div className="flex items-center gap-3 py-10 text-fg-soft" role="status">
        <Spinner label="" /> Loading the test…
      </div>
    );
  if (q.isError) {
    const e = q.error;
    const notFound = e instanceof ApiError && e.status === 404;
    const practiceUrl = e instanceof ApiError ? (e.details?.practiceCallUrl as string | undefined) : undefined;
    if (analysisId && e instanceof ApiError && (e.status === 404 || e.status === 400))
      return (
        <Alert tone="error" title="That analysis version was not found" action={<LinkButton href={versionHref(id, null)}>Show the current analysis</LinkButton>}>
          The link may be mistyped, or the version belongs to another test.
        </Alert>
      );
    if (practiceUrl)
      return (
        <Alert tone="info" title="Practice test: your call first" action={<LinkButton href={practiceUrl}>Make my call</LinkButton>}>
          Look at the curve and say what you think it shows; the analysis appears once you have.
        </Alert>
      );
    return (
      <Alert tone="error" title={notFound ? "Test not found" : "The test could not be loaded"} action={notFound ? <LinkButton href="/vacuum-tests">All tests</LinkButton> : <Button onClick={() => q.refetch()}>Retry</Button>}>
        {notFound ? "It may have been removed, or it is not shared with you." : (e as Error).message}
      </Alert>
    );
  }

  const { test, analysis, series, history, upload, shown: version } = q.data;
  const earlier = !!version && !version.isCurrent;
  const where = [test.site?.name, test.system?.name].filter(Boolean).join(" · ");
  const movesIsolation = tapMode === "isolation" && canReanalyse && !earlier;
  return (
    <div className="space-y-5">
      <header className="space-y-1">
        <p className="text-body text-fg-soft">
          {STATUS_WORDS[test.status] ?? test.status}
          {test.isPractice ? " · practice" : ""} · {dateTimeWords(test.testedAt)}
          {test.technician?.name ? ` · ${test.technician.name}` : ""}
        </p>
        <h1 className="text-headline break-words">{test.title}</h1>
        {where && <p className="text-body">{where}</p>}
        {test.job && (
          <p className="text-body" data-testid="test-job">
            Visit {[test.job.visitedOn, test.job.reason, test.job.reference].filter(Boolean).join(" · ")}
          </p>
        )}
      </header>
      {!earlier && <NextStep testId={id} />}
      {earlier && <VersionBanner testId={id} shown={version} />}
      <VerdictBanner analysis={analysis} />
      {canCurate && <TrainerShortcuts testId={id} title={test.title} />}
      <div>
        <h2 className="sr-only">Curve</h2>
        <LazyDecayChart
          analysis={analysis}
          series={series}
          onPickSeconds={movesIsolation ? setPicked : setCommentAt}
          pickedSeconds={movesIsolation ? picked : commentAt}
          pickLabel={movesIsolation ? "New isolation" : "Comment here"}
          markers={markers}
          highlightSeconds={shown}
        />
        <ChartTapModePicker mode={tapMode} onMode={setTapMode} canMoveIsolation={canReanalyse && !earlier} />
      </div>
      <div className="grid gap-5 lg:grid-cols-2">
        <NumbersPanel analysis={analysis} />
        <div className="space-y-5">
          <SafetyNote full testCautions={analysis.findings.flatMap((f) => f.cautions)} />
        </div>
      </div>
      <FindingsList findings={analysis.findings} cautionsInSafetyBox />
      <PlanCompare analysis={analysis} series={series} volumeLitres={test.volumeLitres ?? null} />
      <RigForTest testId={id} targetNotReached={analysis.findings.some((f) => f.code === "target_not_reached")} />
      <div id="review" className="scroll-mt-4" />
      <TestReviewSection testId={id} canShare={canShare} pickedSeconds={commentAt} onShowSeconds={setShown} onChanged={() => void q.refetch()} />
      <div className="grid gap-5 lg:grid-cols-2">
        {canReanalyse && !earlier && <ReanalyseForm testId={id} analysis={analysis} fromFile={!!upload} pickedSeconds={picked} onPick={setPicked} />}
        <div className="space-y-5">
          <HistoryList history={history} currentId={test.currentAnalysisId} testId={id} shownId={version?.analysisId ?? null} />
          <CustomerNote testId={id} note={test.customerNote ?? null} canWrite={canShare || (!!userId && test.technician?.id === userId)} onSaved={() => void q.refetch()} />
          <Card title="Record">
            <RawDownload testId={id} upload={upload} />
            <ImportPanel analysis={analysis} test={test} />
          </Card>
        </div>
      </div>
    </div>
  );
}
