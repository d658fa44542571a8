"use client";

import { useQuery } from "@tanstack/react-query";
import { Alert, Card, Spinner } from "@/components/ui";
import { getEvents, reviewKeys } from "./api";
import { EVENT_LABEL, STATUS_LABEL, whenWords } from "./words";

export interface AuditTrailProps {
  testId: string;
}

/** Who did what and when: every state change, comment, share and report e-mail, oldest first. */
export function AuditTrail({ testId }: AuditTrailProps) {
  const q = useQuery({ queryKey: reviewKeys.events(testId), queryFn: ({ signal }) => getEvents(testId, signal) });
  return (
    <Card title="Audit trail" data-testid="audit-trail">
      {q.isPending ? (
        <Spinner label="Loading the audit trail" />
      ) : q.isError ? (
        <Alert tone="error">{(q.error as Error).message}</Alert>
      ) : q.data.events.length === 0 ? (
        <p className="text-body text-fg-soft">Nothing recorded yet.</p>
      ) : (
        <ol className="space-y-2">
          {q.data.events.map((e) => (
            <li key={e.id} className="border-l-2 border-surface-line pl-3">
              <p className="text-body">
                <span className="font-medium">{e.actorName}</span> — {EVENT_LABEL[e.kind] ?? e.kind}
                {e.toStatus && e.fromStatus !== e.toStatus && !(EVENT_LABEL[e.kind] ?? "").startsWith(STATUS_LABEL[e.toStatus]) && e.kind !== "accepted_with_reason" && (
                  <span className="text-fg-soft"> → now {STATUS_LABEL[e.toStatus].toLowerCase()}</span>
                )}
              </p>
              {e.note && <p className="text-body text-fg-soft whitespace-pre-wrap">{e.note}</p>}
              <p className="text-caption text-fg-faint">
                <time dateTime={e.createdAt}>{whenWords(e.createdAt)}</time>
              </p>
            </li>
          ))}
        </ol>
      )}
    </Card>
  );
}
