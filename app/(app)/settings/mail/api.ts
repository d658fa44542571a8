/** The browser's calls for the mail outbox page (GET /api/outbox, POST /api/outbox/resend). */
import { apiFetch } from "@/lib/client/api";
import type { MailStatus } from "./words";

export interface OutboxItem {
  id: string;
  testId: string | null;
  to: string;
  subject: string;
  status: MailStatus;
  attempts: number;
  lastError: string | null;
  /** When Riseline tries again by itself (failed rows). */
  nextAttemptAt: string | null;
  createdAt: string;
  sentAt: string | null;
}

/** What "send again" queued; the rows then go out through the delivery job. */
export interface ResendReport {
  queued: string[];
}

export const outboxKeys = {
  all: ["outbox"] as const,
  list: (status: MailStatus | "") => ["outbox", status] as const,
};

export const listOutbox = (status: MailStatus | "", signal?: AbortSignal) =>
  apiFetch<{ mail: OutboxItem[] }>(`/api/outbox${status ? `?status=${status}` : ""}`, {}, { signal });

/** One message by id, or every unsent one of the shop when `id` is left out. */
export const resendOutbox = (id?: string) =>
  apiFetch<ResendReport>("/api/outbox/resend", { method: "POST", body: JSON.stringify(id ? { id } : {}) });
