"use client";

import { useState } from "react";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { Alert, Badge, Button, Card, Spinner, Textarea } from "@/components/ui";
import type { ReviewAction } from "@/lib/review/state";
import { getReviewState, postReviewAction, reviewKeys, type RetestResult, type ReviewState } from "./api";
import { RetestForm, retestWords } from "./RetestForm";
import { STATUS_LABEL, whenWords } from "./words";

export interface ReviewPanelProps {
  testId: string;
  /** Called after any change so the page can refetch the test (its status line). */
  onChanged?: () => void;
}

const BUTTON: Record<ReviewAction, string> = {
  request_review: "Ask for review",
  ask_help: "Ask for help",
  sign_off: "Sign off",
  accept_with_reason: "Accept with a reason",
  send_back: "Send back",
  resubmit: "Resubmit without a new log",
};

const NOTE_LABEL: Partial<Record<ReviewAction, string>> = {
  send_back: "What should the technician do?",
  ask_help: "What do you need help with?",
  resubmit: "What did you change? (optional)",
  sign_off: "Note for the record (optional)",
  accept_with_reason: "Why do you accept a test that does not pass?",
};

/**
 * Review of one test: its status and the actions the member may take now (the server decides
 * which). Send back asks for a request such as "pull down again and hold 15 minutes". On a
 * sent-back test the technician's first action is uploading the re-test log; resubmitting with a
 * note only stays as a quieter choice (for a request that needs no new test, such as a missing note).
 */
export function ReviewPanel({ testId, onChanged }: ReviewPanelProps) {
  const qc = useQueryClient();
  const q = useQuery({ queryKey: reviewKeys.state(testId), queryFn: ({ signal }) => getReviewState(testId, signal) });
  const [open, setOpen] = useState<ReviewAction | null>(null);
  const [note, setNote] = useState("");
  const [retesting, setRetesting] = useState(false);
  const [retested, setRetested] = useState<RetestResult | null>(null);
  const refresh = () => {
    for (const k of [reviewKeys.state(testId), reviewKeys.events(testId), ["test", testId]]) void qc.invalidateQueries({ queryKey: k });
    onChanged?.();
  };
  const m = useMutation({
    mutationFn: ({ action, note }: { action: ReviewAction; note: string }) => postReviewAction(testId, action, note),
    onSuccess: () => {
      setOpen(null);
      setNote("");
      refresh();
    },
  });

  if (q.isPending) return <Card title="Review"><Spinner label="Loading the review state" /></Card>;
  if (q.isError) return <Alert tone="error" title="Review state not loaded">{(q.error as Error).message}</Alert>;
  const { status, helpRequested, actions, retest, lastStep } = q.data;

  const start = (a: ReviewAction) => {
    m.reset();
    setRetesting(false);
    setRetested(null);
    if (a === "request_review") m.mutate({ action: a, note: "" });
    else {
      setOpen(a);
      setNote("");
    }
  };

  return (
    <Card title="Review" actions={<Badge tone={status === "signed_off" ? "pass" : status === "sent_back" ? "attention" : "brand"}>{STATUS_LABEL[status]}</Badge>} data-testid="review-panel">
      <div className="space-y-3">
        {lastStep && <LastStep step={lastStep} />}
        {helpRequested && <p className="text-body font-medium">The technician asked for help.</p>}
        {actions.length === 0 && <p className="text-body text-fg-soft">{status === "signed_off" ? "This record is final." : "Nothing to do here for your role."}</p>}
        {retested && <p className="text-body" role="status" data-testid="retest-done">{retestWords(retested)}</p>}
        {retesting ? (
          <RetestForm
            testId={testId}
            onCancel={() => setRetesting(false)}
            onDone={(r) => {
              setRetesting(false);
              setRetested(r);
              refresh();
            }}
          />
        ) : open ? (
          <form
            className="space-y-3"
            onSubmit={(e) => {
              e.preventDefault();
              m.mutate({ action: open, note });
            }}
          >
            {open === "accept_with_reason" && (
              <div data-testid="accept-warning">
                <Alert tone="warning" title="This test does not pass">
                  Its curve or its profile fails. Accepting it makes the record final and the report says it was accepted with your reason. If
                  the system needs work, send it back instead.
                </Alert>
              </div>
            )}
            {open === "sign_off" && <p className="text-caption text-fg-soft">Signing off makes this record final.</p>}
            <Textarea
              label={NOTE_LABEL[open] ?? "Note"}
              value={note}
              onChange={(e) => setNote(e.target.value)}
              rows={3}
              required={open === "send_back" || open === "ask_help" || open === "accept_with_reason"}
              maxLength={2000}
            />
            <div className="flex flex-wrap gap-2">
              <Button type="submit" busy={m.isPending} variant={open === "send_back" || open === "accept_with_reason" ? "attention" : "primary"}>
                {BUTTON[open]}
              </Button>
              <Button variant="quiet" onClick={() => setOpen(null)}>
                Cancel
              </Button>
            </div>
          </form>
        ) : (
          <div className="flex flex-wrap gap-2">
            {retest && (
              <Button
                onClick={() => {
                  m.reset();
                  setOpen(null);
                  setRetested(null);
                  setRetesting(true);
                }}
              >
                Upload the re-test log
              </Button>
            )}
            {actions.map((a) => (
              <Button key={a} variant={buttonVariant(a, !!retest)} onClick={() => start(a)} busy={m.isPending && m.variables?.action === a}>
                {BUTTON[a]}
              </Button>
            ))}
          </div>
        )}
        {m.isError && <Alert tone="error">{(m.error as Error).message}</Alert>}
      </div>
    </Card>
  );
}

const STEP_WORDS: Record<string, string> = {
  sent_back: "Sent back by",
  signed_off: "Signed off by",
  accepted_with_reason: "Accepted with a reason by",
};

/** What the last step said, in the lead's own words: the request to the technician, or the reason a failing test was kept. */
function LastStep({ step }: { step: NonNullable<ReviewState["lastStep"]> }) {
  const label = step.kind === "sent_back" ? "What the lead asked" : step.kind === "accepted_with_reason" ? "Reason for accepting it" : "Note";
  return (
    <div className={step.kind === "signed_off" ? "" : "rounded-card border border-flare-500 bg-surface p-3"} data-testid="review-last-step">
      <p className="text-caption text-fg-soft">
        {STEP_WORDS[step.kind] ?? "By"} {step.by} · <time dateTime={step.at}>{whenWords(step.at)}</time>
      </p>
      {step.note && (
        <p className="text-body whitespace-pre-wrap">
          <span className="font-medium">{label}: </span>
          {step.note}
        </p>
      )}
    </div>
  );
}

/** The re-test upload is the primary action when offered; a plain resubmit then steps back. */
function buttonVariant(a: ReviewAction, retestOffered: boolean): "primary" | "secondary" | "attention" | "quiet" {
  if (a === "resubmit") return retestOffered ? "quiet" : "primary";
  if (a === "sign_off" || a === "request_review") return "primary";
  return a === "send_back" ? "attention" : "secondary";
}
