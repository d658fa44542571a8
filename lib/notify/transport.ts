/**
 * The one place outgoing mail leaves the process. Tests swap the sender for one pointed at a
 * dead port (a real SMTP failure), never for a fake that pretends to succeed.
 */
import type { Attachment } from "nodemailer/lib/mailer";
import { sendMail, type OutgoingMail } from "@/lib/mail";

export type MailWithAttachments = OutgoingMail & { messageId?: string; attachments?: Pick<Attachment, "filename" | "content" | "contentType">[] };
export type MailSender = (mail: MailWithAttachments) => Promise<void>;

const g = globalThis as unknown as { rlMailSender?: MailSender | null };

export function mailSender(): MailSender {
  return g.rlMailSender ?? (sendMail as MailSender);
}

/** Test seam: route mail through another sender (null restores SMTP from the env). */
export function setMailSenderForTests(sender: MailSender | null): void {
  g.rlMailSender = sender;
}
