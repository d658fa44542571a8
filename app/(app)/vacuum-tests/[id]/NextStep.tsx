"use client";

import { useQuery } from "@tanstack/react-query";
import { getReviewState, reviewKeys } from "@/components/review/api";
import { whenWords } from "@/components/review/words";

/**
 * "What do I do now?" at the top of the test page (first on a phone): a sent-back test shows the
 * lead's request in their words and where to upload the re-test; a test waiting for review says
 * so; a lead sees that a failing test can only be accepted with a reason. Shares the review
 * state's query (and cache) with the Review box further down.
 */
export function NextStep({ testId }: { testId: string }) {
  const q = useQuery({ queryKey: reviewKeys.state(testId), queryFn: ({ signal }) => getReviewState(testId, signal) });
  if (!q.data) return null;
  const { status, lastStep, retest, actions, signOffNeedsReason } = q.data;
  let title: string | null = null;
  let body: string | null = null;
  if (status === "sent_back") {
    title = retest ? "Sent back to you: do this, then upload the re-test log" : "Sent back to the technician";
    body = lastStep?.note ? `${lastStep.by} asks: ${lastStep.note}` : null;
  } else if (status === "waiting_review" && actions.includes("send_back")) {
    title = signOffNeedsReason ? "Waiting for your review — this test does not pass" : "Waiting for your review";
    body = signOffNeedsReason ? "Send it back with what to do, or accept it with a reason." : "Sign it off or send it back.";
  } else if (status === "waiting_review") {
    title = "Waiting for a lead's review";
    body = "Nothing to do until a lead signs it off or sends it back.";
  }
  if (!title) return null;
  return (
    <section aria-label="What to do now" data-testid="next-step" className="rounded-card border-2 border-flare-500 bg-surface-raised px-4 py-3">
      <p className="text-lead font-semibold">{title}</p>
      {body && <p className="mt-1 text-body whitespace-pre-wrap" data-testid="next-step-request">{body}</p>}
      {lastStep && status === "sent_back" && (
        <p className="text-caption text-fg-faint">
          <time dateTime={lastStep.at}>{whenWords(lastStep.at)}</time>
        </p>
      )}
      <a href="#review" className="mt-2 inline-flex min-h-tap items-center text-body text-tide-700 underline dark:text-tide-300">
        Go to the Review box
      </a>
    </section>
  );
}
