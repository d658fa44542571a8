/** Reads what the real SMTP catcher (scripts/fakes.mjs) stored, as a person would read mail. */
import { readdirSync, readFileSync, existsSync } from "node:fs";
import { join } from "node:path";
import type { CaughtMessage } from "@/app/dev/mailbox/read-mailbox";
import { env } from "@/lib/env";

/** A stored message as the dev mailbox page reads it, plus the attachments the catcher records. */
export interface CaughtMail extends CaughtMessage {
  attachments: { filename?: string; contentType: string; size: number }[];
  /** The catcher's id of the SMTP connection the message came over. */
  sessionId: string;
  /** The message's Message-ID header (one outbox row keeps the same one on every try). */
  messageId: string;
  /** Every header by lower-case name (unfolded). */
  headers: Record<string, string>;
}

export function readMailbox(): CaughtMail[] {
  const dir = env().MAILBOX_DIR;
  if (!dir || !existsSync(dir)) return [];
  return readdirSync(dir)
    .filter((f) => f.endsWith(".json"))
    .sort()
    .flatMap((f) => {
      try {
        return [JSON.parse(readFileSync(join(dir, f), "utf8")) as CaughtMail];
      } catch {
        return []; // written by a catcher of an older version while we read: seen on the next poll
      }
    });
}

/** Waits until a message to `to` (optionally matching the subject) arrives; returns the newest. */
export async function waitForMail(to: string, subject?: RegExp, timeoutMs = 10_000): Promise<CaughtMail> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const hit = readMailbox()
      .filter((m) => m.to.includes(to) && (!subject || subject.test(m.subject)))
      .pop();
    if (hit) return hit;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`no mail to ${to}${subject ? ` matching ${subject}` : ""} within ${timeoutMs} ms`);
}

/** The first link into the app found in a message's text body. */
export function firstAppLink(mail: CaughtMail): string {
  const m = /(https?:\/\/127\.0\.0\.1:\d+\/[^\s)]+)/.exec(mail.text);
  if (!m) throw new Error(`no app link in mail "${mail.subject}"`);
  return m[1];
}
