/** The outbox in plain words: a status a person reads, and an SMTP failure said without jargon. */

export type MailStatus = "pending" | "sent" | "failed" | "dead" | "off";

export const MAIL_STATUS_TEXT: Record<MailStatus, { label: string; hint: string }> = {
  pending: { label: "Waiting to send", hint: "Queued; Riseline has not delivered it yet." },
  sent: { label: "Sent", hint: "The mail server accepted it." },
  failed: { label: "Not sent yet", hint: "The last try failed; Riseline tries again by itself." },
  dead: { label: "Gave up", hint: "Riseline stopped trying: the address was refused, or a day of tries went by. Check the address, then send it again." },
  off: { label: "Turned off", hint: "Not sent: the person turned this kind of mail off for themselves." },
};

/** Patterns of what nodemailer and SMTP servers say, most specific first. */
const PLAIN: { test: RegExp; words: string }[] = [
  { test: /ECONNREFUSED|connection refused/i, words: "The mail server refused the connection (it may be down)." },
  { test: /ETIMEDOUT|ESOCKETTIMEDOUT|timed? ?out|Greeting never received/i, words: "The mail server did not answer in time." },
  { test: /ENOTFOUND|EAI_AGAIN|getaddrinfo/i, words: "The mail server's address could not be found." },
  { test: /EAUTH|\b535\b|authentication|Invalid login/i, words: "The mail server did not accept Riseline's sign-in." },
  { test: /ECONNRESET|socket hang up|connection closed/i, words: "The connection to the mail server was cut off." },
  { test: /\b55[0-4]\b|mailbox unavailable|user unknown|no such user|recipient/i, words: "The receiving server refused the address. Check the e-mail address." },
  { test: /\b45\d\b|try again later|temporar/i, words: "The mail server was busy and asked to try later." },
  { test: /TLS|SSL|certificate/i, words: "A secure connection to the mail server could not be made." },
];

/** The last delivery error in words a lead can act on; the raw text is kept short after the words. */
export function mailErrorInWords(lastError: string | null | undefined): string | null {
  if (!lastError || !lastError.trim()) return null;
  const hit = PLAIN.find((p) => p.test.test(lastError));
  if (hit) return hit.words;
  const raw = lastError.trim().replace(/\s+/g, " ");
  return `The mail server answered: “${raw.length > 140 ? `${raw.slice(0, 139)}…` : raw}”`;
}
