/**
 * Who hears about a comment: a reviewer's comment on someone's test goes to that technician; the
 * technician's comment on their own test while it waits for review goes to the leads. Nobody is
 * mailed about their own comment, and other comments (a trainer's, an apprentice's) mail no one.
 * Queued in the comment's transaction; the caller delivers after commit.
 */
import type { Tx } from "@/db/client";
import { getUserEmailById, listReviewerEmailsByOrganization } from "@/db/queries/review";
import type { VacuumTestDetailRow } from "@/db/queries/vacuum-tests";
import type { Actor } from "@/lib/api/handler";
import { commentMail } from "@/lib/notify/messages";
import { queueMail } from "@/lib/notify/outbox";
import { can } from "@/lib/permissions";

export async function queueCommentMail(
  tx: Tx,
  actor: Actor,
  params: { detail: VacuumTestDetailRow; body: string; atSeconds: number | null },
): Promise<string[]> {
  const t = params.detail.test;
  const org = actor.organizationId;
  const summary = { id: t.id, title: t.title, verdict: t.verdict, technicianName: params.detail.createdByName, siteName: params.detail.siteName };
  let to: string[] = [];
  if (actor.userId !== t.createdById && can(actor.role, "tests.review")) {
    const tech = await getUserEmailById(tx, { organizationId: org, userId: t.createdById });
    to = tech ? [tech.email] : [];
  } else if (actor.userId === t.createdById && t.status === "waiting_review") {
    to = (await listReviewerEmailsByOrganization(tx, { organizationId: org })).filter((e) => e !== actor.email);
  }
  return queueMail(
    tx,
    to.map((addr) => ({ ...commentMail(addr, summary, { by: actor.name, body: params.body, atSeconds: params.atSeconds }), organizationId: org, testId: t.id })),
  );
}
