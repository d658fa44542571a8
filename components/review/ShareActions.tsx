"use client";

import { useState } from "react";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { Alert, Button, Card, Input, LinkButton, Textarea } from "@/components/ui";
import { createShareLinkCall, emailReportCall, getShareLinks, reviewKeys, revokeShareLinkCall } from "./api";
import { whenWords } from "./words";
import { CopyButton } from "@/components/ui/CopyButton";

export interface ShareActionsProps {
  testId: string;
  /** reports.share (owner, lead): share links and e-mail; others see only the report links. */
  canShare: boolean;
  /** The customer's address to suggest, if the test's site has one. */
  customerEmail?: string | null;
}

/** The report: open it, print it, get the PDF; for leads, share a read-only link or e-mail it. */
export function ShareActions({ testId, canShare, customerEmail }: ShareActionsProps) {
  const qc = useQueryClient();
  const links = useQuery({ queryKey: reviewKeys.links(testId), queryFn: ({ signal }) => getShareLinks(testId, signal), enabled: canShare });
  const [newUrl, setNewUrl] = useState<string | null>(null);
  const [to, setTo] = useState(customerEmail ?? "");
  const [message, setMessage] = useState("");
  const refresh = () => {
    void qc.invalidateQueries({ queryKey: reviewKeys.links(testId) });
    void qc.invalidateQueries({ queryKey: reviewKeys.events(testId) });
  };
  const create = useMutation({ mutationFn: () => createShareLinkCall(testId, 30), onSuccess: (r) => { setNewUrl(r.url); refresh(); } });
  const revoke = useMutation({ mutationFn: (linkId: string) => revokeShareLinkCall(testId, linkId), onSuccess: refresh });
  const email = useMutation({ mutationFn: () => emailReportCall(testId, to.trim(), message.trim()), onSuccess: () => { setMessage(""); refresh(); } });

  return (
    <Card title="Report" data-testid="share-actions">
      <div className="space-y-4">
        <div className="flex flex-wrap gap-2">
          <LinkButton href={`/vacuum-tests/${testId}/report`} variant="secondary">Open the report</LinkButton>
          <LinkButton href={`/api/vacuum-tests/${testId}/report?download=1`} variant="quiet" prefetch={false}>Download PDF</LinkButton>
        </div>
        {canShare && (
          <>
            <div className="space-y-2">
              <Button variant="secondary" onClick={() => create.mutate()} busy={create.isPending}>Make a read-only link (30 days)</Button>
              {newUrl && (
                <Alert tone="success" title="Link made — copy it now, it is shown once">
                  <input readOnly value={newUrl} aria-label="Share link" className="mt-1 w-full rounded-lg border border-surface-line bg-surface-raised px-2 py-1 text-caption" onFocus={(e) => e.currentTarget.select()} />
                  <div className="mt-2">
                    <CopyButton text={newUrl} label="Copy the link" />
                  </div>
                </Alert>
              )}
              {create.isError && <Alert tone="error">{(create.error as Error).message}</Alert>}
              {links.data && links.data.links.length > 0 && (
                <ul className="space-y-1">
                  {links.data.links.map((l) => (
                    <li key={l.id} className="flex flex-wrap items-center justify-between gap-2 text-caption">
                      <span>
                        {l.state === "active" ? `Active until ${whenWords(l.expiresAt)}` : l.state === "revoked" ? `Revoked ${whenWords(l.revokedAt!)}` : `Expired ${whenWords(l.expiresAt)}`} · by {l.createdByName}
                      </span>
                      {l.state === "active" && (
                        <Button variant="quiet" onClick={() => revoke.mutate(l.id)} busy={revoke.isPending && revoke.variables === l.id}>Revoke</Button>
                      )}
                    </li>
                  ))}
                </ul>
              )}
            </div>
            <form
              className="space-y-3 border-t border-surface-line pt-4"
              onSubmit={(e) => {
                e.preventDefault();
                email.mutate();
              }}
            >
              <Input label="E-mail the report to" type="email" value={to} onChange={(e) => setTo(e.target.value)} required autoComplete="email" />
              <Textarea label="Message (optional)" value={message} onChange={(e) => setMessage(e.target.value)} rows={2} maxLength={2000} />
              <Button type="submit" busy={email.isPending}>Send the report</Button>
              {email.isSuccess && <Alert tone="success">Report sent with the PDF attached.</Alert>}
              {email.isError && <Alert tone="error">{(email.error as Error).message}</Alert>}
            </form>
          </>
        )}
      </div>
    </Card>
  );
}
