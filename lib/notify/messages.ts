/**
 * The words of every notification. Plain text and HTML from the same paragraphs (composeMail),
 * a link back into the app, and nothing secret: no passwords, no tokens, no raw readings.
 */
import { composeMail, type OutgoingMail } from "@/lib/mail";
import { env } from "@/lib/env";
import { storyLine } from "@/lib/reports/words";

export interface VacuumTestSummary {
  id: string;
  title: string;
  verdict: string | null;
  /** The profile half of the story, when the sender knows it. */
  meetsProfile?: boolean | null;
  technicianName: string;
  siteName?: string | null;
}

export function testUrl(testId: string): string {
  return new URL(`/vacuum-tests/${testId}`, env().BETTER_AUTH_URL).toString();
}

/** The two statements (curve, profile) and the site, in the words of every screen. */
function verdictLine(t: VacuumTestSummary): string {
  return `${storyLine(t.verdict, t.meetsProfile)}${t.siteName ? ` Site: ${t.siteName}.` : ""}`;
}

export function reviewRequestedMail(to: string, t: VacuumTestSummary, opts: { by: string | null; help: boolean; note?: string | null; automatic?: string }): OutgoingMail {
  const who = opts.by ?? "Riseline";
  const headline = opts.help
    ? `${who} asks for help with "${t.title}".`
    : opts.automatic
      ? `"${t.title}" by ${t.technicianName} went into the review queue: ${opts.automatic}.`
      : `${who} asks you to review "${t.title}".`;
  return composeMail({
    to,
    subject: opts.help ? `Help asked: ${t.title}` : `Review requested: ${t.title}`,
    paragraphs: [headline, verdictLine(t), ...(opts.note ? [`Note: ${opts.note}`] : [])],
    link: { label: "Open the test", url: testUrl(t.id) },
    kind: "review_request",
  });
}

/** To the leads: the technician put a re-test log on a sent-back test; it waits for review again. */
export function retestUploadedMail(to: string, t: VacuumTestSummary, opts: { by: string; version: number; note?: string | null }): OutgoingMail {
  return composeMail({
    to,
    subject: `Re-test to review: ${t.title}`,
    paragraphs: [
      `${opts.by} uploaded the re-test log of "${t.title}" (analysis version ${opts.version}) and resubmitted it for review.`,
      verdictLine(t),
      ...(opts.note ? [`Note: ${opts.note}`] : []),
    ],
    link: { label: "Open the test", url: testUrl(t.id) },
    kind: "review_request",
  });
}

/** A comment on a test, to whoever should answer it (the technician, or the leads). */
export function commentMail(to: string, t: VacuumTestSummary, opts: { by: string; body: string; atSeconds: number | null }): OutgoingMail {
  const at = opts.atSeconds != null ? ` at ${(opts.atSeconds / 60).toFixed(1)} min on the curve` : "";
  return composeMail({
    to,
    subject: `Comment on: ${t.title}`,
    paragraphs: [`${opts.by} commented on "${t.title}"${at}:`, opts.body, verdictLine(t)],
    link: { label: "Open the test", url: testUrl(t.id) },
    kind: "comment",
  });
}

export function signedOffMail(to: string, t: VacuumTestSummary, opts: { by: string; note?: string | null; acceptedWithReason?: boolean }): OutgoingMail {
  if (opts.acceptedWithReason) {
    return composeMail({
      to,
      subject: `Accepted with a reason: ${t.title}`,
      paragraphs: [`${opts.by} accepted "${t.title}" although it does not pass.`, verdictLine(t), `Reason: ${opts.note ?? ""}`],
      link: { label: "Open the test", url: testUrl(t.id) },
    kind: "review_outcome",
    });
  }
  return composeMail({
    to,
    subject: `Signed off: ${t.title}`,
    paragraphs: [`${opts.by} signed off "${t.title}".`, verdictLine(t), ...(opts.note ? [`Note: ${opts.note}`] : [])],
    link: { label: "Open the test", url: testUrl(t.id) },
    kind: "review_outcome",
  });
}

export function sentBackMail(to: string, t: VacuumTestSummary, opts: { by: string; request: string }): OutgoingMail {
  return composeMail({
    to,
    subject: `Sent back: ${t.title}`,
    paragraphs: [
      `${opts.by} sent "${t.title}" back to you.`,
      `What to do: ${opts.request}`,
      "When you have done it, upload the re-test log on the test's page; it goes back to the review queue.",
    ],
    link: { label: "Open the test", url: testUrl(t.id) },
    kind: "review_outcome",
  });
}

/**
 * To a customer: the report as a PDF attachment, no link into the app (they are not members). The
 * date is the shop's own calendar date (`testedOn`, in its time zone); `hold` is the report's own
 * sentence of the hold's numbers, so the message and the PDF quote the same figures.
 */
export function reportMail(
  to: string,
  t: VacuumTestSummary & { organizationName: string; testedOn: string },
  opts: { message?: string | null; hold?: string | null; customerNote?: string | null },
): OutgoingMail {
  return composeMail({
    to,
    subject: `Vacuum test report — ${t.siteName ?? t.title}`,
    paragraphs: [
      `${t.organizationName} sends you the report of the evacuation and decay test "${t.title}" made on ${t.testedOn} by ${t.technicianName}.`,
      verdictLine(t),
      ...(opts.hold ? [opts.hold] : []),
      ...(opts.customerNote ? [`Note for you: ${opts.customerNote}`] : []),
      ...(opts.message ? [opts.message] : []),
      "The report is attached as a PDF.",
    ],
  });
}

/** To a rig's keeper (or the leads when nobody keeps it): upkeep reminders that just came up. */
export function rigRemindersMail(to: string, rig: { id: string; name: string }, reminders: { title: string; message: string }[]): OutgoingMail {
  return composeMail({
    to,
    subject: reminders.length === 1 ? `Rig upkeep: ${reminders[0].title}` : `Rig upkeep: ${reminders.length} reminders for ${rig.name}`,
    paragraphs: [`Upkeep for the rig "${rig.name}":`, ...reminders.map((r) => `${r.title}. ${r.message}`), "Log the work on the rig's page when it is done."],
    kind: "rig_reminder",
    link: { label: "Open the rig", url: new URL(`/tools/rigs/${rig.id}`, env().BETTER_AUTH_URL).toString() },
  });
}
