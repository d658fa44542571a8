/** The note for the customer's copy of the report: kept apart from the internal notes, never mixed. */
import type { Db } from "@/db/client";
import { updateTestCustomerNoteById } from "@/db/queries/vacuum-tests";
import type { Actor } from "@/lib/api/handler";
import { AppError } from "@/lib/errors";
import { allows } from "@/lib/permissions";
import { requireVisibleTest } from "./read";

/** The policy "vacuumTest.writeCustomerNote" (lib/permissions.ts): the test's technician, and whoever may share reports (owner, lead). */
export function mayWriteCustomerNote(actor: Pick<Actor, "userId" | "role">, createdById: string): boolean {
  return allows(actor, "vacuumTest.writeCustomerNote", { createdById });
}

export async function setCustomerNote(db: Db, actor: Actor, testId: string, customerNote: string | null) {
  const row = await requireVisibleTest(db, actor, testId);
  if (!mayWriteCustomerNote(actor, row.test.createdById))
    throw new AppError("forbidden", "Only the test's technician, a lead or the owner can write the note for the customer.");
  if (!(await updateTestCustomerNoteById(db, { organizationId: actor.organizationId, testId, customerNote }))) throw new AppError("not_found", "No such test.");
  return { testId, customerNote };
}
