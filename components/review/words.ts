import type { Status } from "./api";

export const STATUS_LABEL: Record<Status, string> = {
  submitted: "Submitted",
  waiting_review: "Waiting for review",
  signed_off: "Signed off",
  sent_back: "Sent back",
};

export const EVENT_LABEL: Record<string, string> = {
  submitted: "Submitted",
  review_requested: "Asked for review",
  help_requested: "Asked for help",
  signed_off: "Signed off",
  accepted_with_reason: "Accepted with a reason (the test does not pass)",
  sent_back: "Sent back",
  resubmitted: "Resubmitted",
  retest_uploaded: "Uploaded the re-test log and resubmitted",
  commented: "Commented",
  report_emailed: "E-mailed the report",
  share_link_created: "Made a share link",
  share_link_revoked: "Revoked a share link",
};

/** 1500 s → "25.0 min". */
export function minutesWords(seconds: number): string {
  return `${(seconds / 60).toFixed(1)} min`;
}

export function whenWords(iso: string): string {
  return new Date(iso).toLocaleString("en-US", { dateStyle: "medium", timeStyle: "short" });
}
