/**
 * The practice gate: an apprentice makes their own call on a practice test before the app
 * shows the analysis. Every surface that shows a verdict, findings or fitted numbers to an
 * apprentice asks this first (the tests API, the practice pages, the casebook, the overlay).
 */
import type { Db } from "@/db/client";
import { getPracticeFlagByTest, listUncalledPracticeTestIdsByApprentice } from "@/db/queries/practice";
import type { Role } from "@/lib/permissions";

/** Only apprentices practise; every other role sees analyses as usual. */
export function practisesCalls(role: Role): boolean {
  return role === "apprentice";
}

/**
 * "hidden" when the viewer is an apprentice and the test is a practice test they have not called
 * yet (show the curve only: no verdict, findings or fitted numbers); "visible" otherwise.
 * Fails closed: for an apprentice, a test that is not in the organization is "hidden" (the
 * caller answers 404 for it anyway).
 */
export async function practiceGate(
  db: Db,
  params: { organizationId: string; testId: string; userId: string; role: Role },
): Promise<"hidden" | "visible"> {
  if (!practisesCalls(params.role)) return "visible";
  const flag = await getPracticeFlagByTest(db, { organizationId: params.organizationId, testId: params.testId });
  if (!flag) return "hidden";
  if (!flag.isPractice) return "visible";
  const uncalled = await listUncalledPracticeTestIdsByApprentice(db, { organizationId: params.organizationId, apprenticeId: params.userId, testIds: [params.testId] });
  return uncalled.length ? "hidden" : "visible";
}

/** The batch form for lists: of testIds, those whose analysis stays hidden from this viewer. */
export async function hiddenPracticeTestIds(
  db: Db,
  params: { organizationId: string; userId: string; role: Role; testIds: string[] },
): Promise<Set<string>> {
  if (!practisesCalls(params.role) || params.testIds.length === 0) return new Set();
  return new Set(await listUncalledPracticeTestIdsByApprentice(db, { organizationId: params.organizationId, apprenticeId: params.userId, testIds: params.testIds }));
}
