"use client";

import { useState } from "react";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { Alert, Button, EmptyState, LinkButton, Select, Spinner } from "@/components/ui";
import { listOutbox, outboxKeys, resendOutbox, type OutboxItem, type ResendReport } from "./api";
import { MailStatusBadge } from "./MailStatusBadge";
import { MAIL_STATUS_TEXT, mailErrorInWords, type MailStatus } from "./words";

function when(iso: string | null): string {
  if (!iso) return "—";
  const d = new Date(iso);
  return Number.isNaN(d.getTime()) ? iso : d.toLocaleString("en-US", { month: "short", day: "numeric", hour: "numeric", minute: "2-digit" });
}

function reportWords(r: ResendReport): string {
  if (!r.queued.length) return "Nothing was waiting to be sent.";
  return `${r.queued.length} message${r.queued.length === 1 ? "" : "s"} queued to send now; this list follows them.`;
}

/** While anything is still to go, the list refreshes itself. */
const REFRESH_MS = 3000;

function MailRow({ m, onResend, busy }: { m: OutboxItem; onResend: (id: string) => void; busy: boolean }) {
  const error = m.status === "sent" ? null : mailErrorInWords(m.lastError);
  return (
    <li data-testid="mail-row" data-status={m.status} className="rounded-card border border-surface-line bg-surface-raised px-4 py-3 shadow-card">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <MailStatusBadge status={m.status} />
        <span className="text-caption text-fg-soft">Queued {when(m.createdAt)}</span>
      </div>
      <p className="mt-1 break-words text-lead font-semibold text-fg">{m.subject}</p>
      <dl className="mt-1 grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5 text-body">
        <dt className="text-fg-soft">To</dt>
        <dd className="break-all">{m.to}</dd>
        <dt className="text-fg-soft">Tries</dt>
        <dd className="tabular-nums">{m.attempts}</dd>
        {m.status === "sent" && (
          <>
            <dt className="text-fg-soft">Sent</dt>
            <dd>{when(m.sentAt)}</dd>
          </>
        )}
        {m.status === "failed" && m.nextAttemptAt && (
          <>
            <dt className="text-fg-soft">Next try</dt>
            <dd data-testid="mail-next-try">{when(m.nextAttemptAt)}, by itself</dd>
          </>
        )}
        {error && (
          <>
            <dt className="text-fg-soft">Problem</dt>
            <dd data-testid="mail-error">{error}</dd>
          </>
        )}
      </dl>
      {(m.status !== "sent" || m.testId) && (
        <div className="mt-3 flex flex-wrap gap-2">
          {m.status !== "sent" && m.status !== "off" && (
            <Button variant="secondary" busy={busy} onClick={() => onResend(m.id)}>
              Send again
            </Button>
          )}
          {m.testId && (
            <LinkButton variant="quiet" href={`/vacuum-tests/${m.testId}`}>
              Open the test
            </LinkButton>
          )}
        </div>
      )}
    </li>
  );
}

/** The shop's outgoing mail, newest first, with a status filter and "Send again". */
export function MailOutbox() {
  const qc = useQueryClient();
  const [status, setStatus] = useState<MailStatus | "">("");
  const q = useQuery({
    queryKey: outboxKeys.list(status),
    queryFn: ({ signal }) => listOutbox(status, signal),
    refetchInterval: (query) => (query.state.data?.mail.some((m) => m.status === "pending" || m.status === "failed") ? REFRESH_MS : false),
  });
  const resend = useMutation({
    mutationFn: (id?: string) => resendOutbox(id),
    onSettled: () => void qc.invalidateQueries({ queryKey: outboxKeys.all }),
  });
  const mail = q.data?.mail ?? [];
  const unsent = mail.filter((m) => m.status !== "sent").length;

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-end gap-3">
        <Select label="Show" value={status} onChange={(e) => setStatus(e.target.value as MailStatus | "")} className="min-w-48 flex-1">
          <option value="">All mail</option>
          {(Object.keys(MAIL_STATUS_TEXT) as MailStatus[]).map((s) => (
            <option key={s} value={s}>{MAIL_STATUS_TEXT[s].label}</option>
          ))}
        </Select>
        <Button busy={resend.isPending && resend.variables === undefined} disabled={resend.isPending} onClick={() => resend.mutate(undefined)}>
          Send all unsent
        </Button>
      </div>
      {resend.isSuccess && <Alert tone="success">{reportWords(resend.data)}</Alert>}
      {resend.isError && <Alert tone="error">{(resend.error as Error).message}</Alert>}
      {q.isPending ? (
        <div className="flex items-center gap-3 py-8 text-fg-soft" role="status">
          <Spinner label="" /> Loading mail…
        </div>
      ) : q.isError ? (
        <Alert tone="error" title="The mail could not be loaded" action={<Button onClick={() => q.refetch()}>Retry</Button>}>
          {(q.error as Error).message}
        </Alert>
      ) : mail.length === 0 ? (
        <EmptyState title={status ? `No mail “${MAIL_STATUS_TEXT[status].label.toLowerCase()}”` : "No mail yet"}>
          {status ? "Choose “All mail” to see the rest." : "Review requests, sign-offs, comments and e-mailed reports will show here."}
        </EmptyState>
      ) : (
        <>
          <p className="text-caption text-fg-soft" aria-live="polite">
            {mail.length} message{mail.length === 1 ? "" : "s"}
            {unsent ? `, ${unsent} not sent yet` : ""} (newest first)
          </p>
          <ul className="space-y-3" data-testid="mail-list">
            {mail.map((m) => (
              <MailRow key={m.id} m={m} onResend={(id) => resend.mutate(id)} busy={resend.isPending && resend.variables === m.id} />
            ))}
          </ul>
        </>
      )}
    </div>
  );
}
