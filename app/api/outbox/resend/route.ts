import { z } from "zod";
import { db } from "@/db/client";
import { hasUnsentOutboxMailById } from "@/db/queries/outbox";
import { route } from "@/lib/api/handler";
import { deliverMail, resendUnsentMail } from "@/lib/notify/outbox";
import { AppError } from "@/lib/errors";

const body = z.object({ id: z.string().uuid().optional() });

/** Try again: one message (whatever its attempt count), or every unsent one of the organization. */
export const POST = route({ permission: "tests.review", body }, async ({ actor, body }) => {
  if (body.id) {
    const ok = await hasUnsentOutboxMailById(db(), { organizationId: actor.organizationId, id: body.id });
    if (!ok) throw new AppError("not_found", "No unsent message with that id.");
    return deliverMail(db(), [body.id], { byPerson: true });
  }
  return resendUnsentMail(db(), { organizationId: actor.organizationId });
});
