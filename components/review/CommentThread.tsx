"use client";

import { useState } from "react";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { Alert, Button, Card, Input, Spinner, Textarea } from "@/components/ui";
import { getComments, postComment, reviewKeys } from "./api";
import { minutesWords, whenWords } from "./words";

export interface CommentThreadProps {
  testId: string;
  /** A time picked on the page's curve (seconds from the first row); fills "at minute". */
  pickedSeconds?: number | null;
  /** Called when a comment's time is tapped, so the page can mark it on the curve. */
  onShowSeconds?: (seconds: number) => void;
  /** False hides the form (a reader without tests.comment). */
  canComment?: boolean;
}

/** Comments on a test, each optionally at a time on the curve, oldest first. */
export function CommentThread({ testId, pickedSeconds = null, onShowSeconds, canComment = true }: CommentThreadProps) {
  const qc = useQueryClient();
  const q = useQuery({ queryKey: reviewKeys.comments(testId), queryFn: ({ signal }) => getComments(testId, signal) });
  const [body, setBody] = useState("");
  const [atMinutes, setAtMinutes] = useState("");
  // A new tap on the curve fills the minute field (state adjusted during render, not in an effect).
  const [seenPick, setSeenPick] = useState<number | null>(pickedSeconds);
  if (pickedSeconds !== seenPick) {
    setSeenPick(pickedSeconds);
    if (pickedSeconds != null) setAtMinutes((pickedSeconds / 60).toFixed(1));
  }
  const m = useMutation({
    mutationFn: () => {
      const minutes = atMinutes.trim() === "" ? null : Number(atMinutes.replace(",", "."));
      return postComment(testId, body.trim(), minutes == null || !Number.isFinite(minutes) ? null : Math.round(minutes * 60 * 10) / 10);
    },
    onSuccess: () => {
      setBody("");
      setAtMinutes("");
      void qc.invalidateQueries({ queryKey: reviewKeys.comments(testId) });
      void qc.invalidateQueries({ queryKey: reviewKeys.events(testId) });
    },
  });

  return (
    <Card title="Comments" data-testid="comment-thread">
      {q.isPending ? (
        <Spinner label="Loading comments" />
      ) : q.isError ? (
        <Alert tone="error">{(q.error as Error).message}</Alert>
      ) : q.data.comments.length === 0 ? (
        <p className="text-body text-fg-soft">No comments yet.</p>
      ) : (
        <ol className="space-y-3">
          {q.data.comments.map((c) => (
            <li key={c.id} className="rounded-xl border border-surface-line p-3">
              <p className="text-caption text-fg-soft">
                {c.authorName} · {whenWords(c.createdAt)}
                {c.atSeconds != null && (
                  <>
                    {" · "}
                    {onShowSeconds ? (
                      <button type="button" className="font-medium text-tide-700 underline dark:text-tide-200" onClick={() => onShowSeconds(c.atSeconds!)}>
                        at {minutesWords(c.atSeconds)}
                      </button>
                    ) : (
                      <span className="font-medium">at {minutesWords(c.atSeconds)}</span>
                    )}
                  </>
                )}
              </p>
              <p className="mt-1 whitespace-pre-wrap text-body">{c.body}</p>
            </li>
          ))}
        </ol>
      )}
      {canComment && (
        <form
          className="mt-4 space-y-3"
          onSubmit={(e) => {
            e.preventDefault();
            if (body.trim()) m.mutate();
          }}
        >
          <Textarea label="Comment" value={body} onChange={(e) => setBody(e.target.value)} rows={3} maxLength={4000} required />
          <Input label="At minute on the curve (optional)" inputMode="decimal" value={atMinutes} onChange={(e) => setAtMinutes(e.target.value)} hint="Minutes from the start of the log; tap the curve to fill it." />
          <Button type="submit" busy={m.isPending}>
            Add comment
          </Button>
          {m.isError && <Alert tone="error">{(m.error as Error).message}</Alert>}
        </form>
      )}
    </Card>
  );
}
