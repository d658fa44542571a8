/** The kinds of mail a person may turn off, in the words of every screen (safe for the browser). */
import type { MailKind } from "@/db/schema";

export const MAIL_KIND_WORDS: Record<MailKind, { label: string; hint: string }> = {
  review_request: { label: "Review requests", hint: "A test waits for review, help is asked, or a re-test was uploaded." },
  comment: { label: "Comments", hint: "Someone commented on a test you made or review." },
  review_outcome: { label: "Sign-off notices", hint: "Your test was signed off, accepted with a reason, or sent back." },
  rig_reminder: { label: "Rig upkeep reminders", hint: "A hose, core tool or gauge of your rig is due for upkeep." },
};
