/** The browser's calls for review, comments, the audit trail, share links and report e-mail. */
import { apiFetch } from "@/lib/client/api";
import type { ReviewAction } from "@/lib/review/state";

import type { TestStatus, Verdict } from "@/db/vocabulary";

export type Status = TestStatus;

export interface ReviewState {
  status: Status;
  helpRequested: boolean;
  actions: ReviewAction[];
  /** The caller may upload the re-test log now. */
  retest?: boolean;
  /** The curve or the profile fails: only "accept with a reason" signs it off. */
  signOffNeedsReason?: boolean;
  /** The step that put it where it is (sent back with the lead's request, signed off, accepted with a reason). */
  lastStep?: { kind: string; by: string; at: string; note: string | null } | null;
}

export interface RetestResult {
  analysisId: string;
  version: number;
  status: Status;
  analysis: { verdict: Verdict };
}
export interface CommentItem {
  id: string;
  body: string;
  atSeconds: number | null;
  createdAt: string;
  authorId: string;
  authorName: string;
}
export interface EventItem {
  id: string;
  kind: string;
  fromStatus: Status | null;
  toStatus: Status | null;
  note: string | null;
  createdAt: string;
  actorName: string;
}
export interface ShareLinkItem {
  id: string;
  state: "active" | "expired" | "revoked";
  expiresAt: string;
  revokedAt: string | null;
  createdAt: string;
  createdByName: string;
}

export const reviewKeys = {
  state: (id: string) => ["review", id] as const,
  comments: (id: string) => ["comments", id] as const,
  events: (id: string) => ["events", id] as const,
  links: (id: string) => ["share-links", id] as const,
};

export const getReviewState = (id: string, signal?: AbortSignal) => apiFetch<ReviewState>(`/api/vacuum-tests/${id}/review`, {}, { signal });
export const postReviewAction = (id: string, action: ReviewAction, note?: string) =>
  apiFetch<{ status: Status }>(`/api/vacuum-tests/${id}/review`, { method: "POST", body: JSON.stringify({ action, note: note || null }) });
/** POST /api/vacuum-tests/:id/retests: the re-test log (multipart), the same key on every retry. */
export const postRetest = (id: string, file: File, note: string, idempotencyKey: string) => {
  const form = new FormData();
  form.set("file", file, file.name);
  if (note.trim()) form.set("note", note.trim());
  return apiFetch<RetestResult>(`/api/vacuum-tests/${id}/retests`, { method: "POST", body: form }, { idempotencyKey });
};
export const getComments = (id: string, signal?: AbortSignal) => apiFetch<{ comments: CommentItem[] }>(`/api/vacuum-tests/${id}/comments`, {}, { signal });
export const postComment = (id: string, body: string, atSeconds: number | null) =>
  apiFetch<{ comment: CommentItem }>(`/api/vacuum-tests/${id}/comments`, { method: "POST", body: JSON.stringify({ body, atSeconds }) });
export const getEvents = (id: string, signal?: AbortSignal) => apiFetch<{ events: EventItem[] }>(`/api/vacuum-tests/${id}/events`, {}, { signal });
export const getShareLinks = (id: string, signal?: AbortSignal) => apiFetch<{ links: ShareLinkItem[] }>(`/api/vacuum-tests/${id}/share-links`, {}, { signal });
export const createShareLinkCall = (id: string, expiresInDays: number) =>
  apiFetch<{ id: string; url: string; expiresAt: string }>(`/api/vacuum-tests/${id}/share-links`, { method: "POST", body: JSON.stringify({ expiresInDays }) });
export const revokeShareLinkCall = (id: string, linkId: string) => apiFetch<{ id: string }>(`/api/vacuum-tests/${id}/share-links/${linkId}`, { method: "DELETE" });
export const emailReportCall = (id: string, to: string, message: string) =>
  apiFetch<{ outboxId: string }>(`/api/vacuum-tests/${id}/email-report`, { method: "POST", body: JSON.stringify({ to, message: message || null }) });
