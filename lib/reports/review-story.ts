/**
 * The review status of a test as the report tells it: who did what and when (sent back, signed off,
 * asked for review), in the shop's time zone. Never "not signed off" for a test that was sent back:
 * each status has its own words. An acceptance with a reason (a lead keeping a test whose curve or
 * profile fails, `accepted_with_reason`) is told as such, with the reason, never as a plain sign-off.
 */
import type { TestStatus } from "@/db/schema";
import { whenInZone } from "./time";

export interface ReviewEventRow {
  kind: string;
  at: Date;
  note: string | null;
  actorName: string | null;
}

export interface ReviewStory {
  status: TestStatus;
  /** The headline: "Signed off by Lena Lead on 3 March 2026, 14:05 CST". */
  headline: string;
  /** Earlier steps, newest first, one line each. */
  history: string[];
  /** Filled when the lead accepted a test that does not pass, with the reason; null otherwise. */
  acceptedWithReason: { by: string; at: string; reason: string } | null;
}

const who = (e: ReviewEventRow) => e.actorName ?? (e.kind === "review_requested" ? "Riseline" : "A former member");

function lineOf(e: ReviewEventRow, timeZone: string): string {
  const when = whenInZone(e.at, timeZone);
  const note = e.note ? `: ${e.note.replace(/\s+$/, "").replace(/[.;:,]$/, "")}` : "";
  switch (e.kind) {
    case "signed_off":
      return `Signed off by ${who(e)} on ${when}${note}.`;
    case "accepted_with_reason":
      return `Accepted with a reason by ${who(e)} on ${when}${note}.`;
    case "sent_back":
      return `Sent back by ${who(e)} on ${when}${note}.`;
    case "review_requested":
      return `Review asked by ${who(e)} on ${when}${note}.`;
    case "help_requested":
      return `Help asked by ${who(e)} on ${when}${note}.`;
    case "resubmitted":
      return `Resubmitted by ${who(e)} on ${when}${note}.`;
    case "retest_uploaded":
      return `Re-test uploaded by ${who(e)} on ${when}${note}.`;
    default:
      return `${e.kind.replace(/_/g, " ")} by ${who(e)} on ${when}${note}.`;
  }
}

/** The story of a test's review; `events` newest first (listReviewEventsByTest). */
export function reviewStoryOf(status: TestStatus, events: ReviewEventRow[], timeZone: string): ReviewStory {
  const last = (kind: string) => events.find((e) => e.kind === kind) ?? null;
  let headline: string;
  const signed = events.find((e) => e.kind === "signed_off" || e.kind === "accepted_with_reason") ?? null;
  const sent = last("sent_back");
  if (status === "signed_off" && signed?.kind === "accepted_with_reason") headline = `Accepted with a reason by ${who(signed)} on ${whenInZone(signed.at, timeZone)}; the test does not pass.`;
  else if (status === "signed_off" && signed) headline = lineOf(signed, timeZone);
  else if (status === "sent_back" && sent) headline = lineOf(sent, timeZone);
  else if (status === "sent_back") headline = "Sent back for another test.";
  else if (status === "waiting_review") headline = "Waiting for a lead's review; not reviewed yet.";
  else if (status === "signed_off") headline = "Signed off.";
  else headline = "Submitted; no review asked.";
  const shown = status === "signed_off" ? signed : status === "sent_back" ? sent : null;
  const accepted =
    status === "signed_off" && signed?.kind === "accepted_with_reason"
      ? { by: who(signed), at: whenInZone(signed.at, timeZone), reason: signed.note ?? "" }
      : null;
  return { status, headline, history: events.filter((e) => e !== shown).map((e) => lineOf(e, timeZone)), acceptedWithReason: accepted };
}
