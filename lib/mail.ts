import nodemailer, { type Transporter } from "nodemailer";
import type { MailKind } from "@/db/schema";
import { env } from "@/lib/env";
import { describeError, log } from "@/lib/log";

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html: string;
  /** Set by the outbox so every try of one message carries the same Message-ID. */
  messageId?: string;
  /** The kind a person may turn off (db/schema/mail.ts); absent: essential, never unsubscribable. */
  kind?: MailKind;
  /** Set at send time: the shop's sender name before MAIL_FROM's address, and List-Unsubscribe. */
  from?: string | { name: string; address: string };
  headers?: Record<string, string>;
}

/**
 * How long an idle SMTP connection stays open for the next message. A burst of uploads shares one
 * connection (no connect, greeting and EHLO per message); a quiet process lets it go, so a script
 * that sent mail still exits by itself shortly after.
 */
const IDLE_CLOSE_MS = 1500;

let transport: Transporter | null = null;

/**
 * The pooled transport. Every wait is bounded (nodemailer's defaults are 2 minutes to connect and
 * 10 minutes of silence): connecting and the server's greeting within SMTP_CONNECT_TIMEOUT_MS, and
 * a connection silent for SMTP_SOCKET_TIMEOUT_MS is dropped — so a frozen mail server fails a send
 * (the message stays in the outbox) instead of holding it.
 */
function transporter(): Transporter {
  if (!transport) {
    const e = env();
    const pooled = nodemailer.createTransport({
      pool: true,
      maxConnections: 2,
      idleTimeout: IDLE_CLOSE_MS,
      host: e.SMTP_HOST,
      port: e.SMTP_PORT,
      secure: false,
      ignoreTLS: true,
      connectionTimeout: e.SMTP_CONNECT_TIMEOUT_MS,
      greetingTimeout: e.SMTP_CONNECT_TIMEOUT_MS,
      socketTimeout: e.SMTP_SOCKET_TIMEOUT_MS,
      dnsTimeout: e.SMTP_CONNECT_TIMEOUT_MS,
    });
    // A pooled connection can fail while idle; the next send reconnects, so log and go on.
    pooled.on("error", (err) => log.warn("SMTP connection closed with an error", { err: describeError(err) }));
    transport = pooled;
  }
  return transport;
}

/** Send one message over the shared SMTP pool. Throws when the server refuses or is unreachable. */
export async function sendMail(mail: OutgoingMail): Promise<void> {
  await transporter().sendMail({ ...mail, from: mail.from ?? env().MAIL_FROM });
}

/** Close the SMTP pool now (scripts and tests that want to exit at once; the next send reopens it). */
export function closeMail(): void {
  transport?.close();
  transport = null;
}

const escapeHtml = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]!);

/** Plain text and HTML from the same paragraphs and one call-to-action link. */
export function composeMail(opts: { to: string; subject: string; paragraphs: string[]; link?: { label: string; url: string }; kind?: MailKind }): OutgoingMail {
  const text = [...opts.paragraphs, ...(opts.link ? [`${opts.link.label}: ${opts.link.url}`] : []), "", "— Riseline"].join("\n\n");
  const html = [
    `<div style="font-family:'IBM Plex Sans',Arial,sans-serif;font-size:16px;line-height:1.5;color:#14232b">`,
    ...opts.paragraphs.map((p) => `<p>${escapeHtml(p)}</p>`),
    opts.link
      ? `<p><a href="${escapeHtml(opts.link.url)}" style="display:inline-block;padding:12px 18px;background:#0b6e69;color:#fff;border-radius:8px;text-decoration:none">${escapeHtml(opts.link.label)}</a></p><p style="font-size:13px;color:#50616b">${escapeHtml(opts.link.url)}</p>`
      : "",
    `<p style="font-size:13px;color:#50616b">— Riseline</p></div>`,
  ].join("");
  return { to: opts.to, subject: opts.subject, text, html, ...(opts.kind ? { kind: opts.kind } : {}) };
}
