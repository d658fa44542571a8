import { z } from "zod";
import { db } from "@/db/client";
import { route } from "@/lib/api/handler";
import { requeueUnsentMail } from "@/lib/notify/outbox";
import { AppError } from "@/lib/errors";

const body = z.object({ id: z.string().uuid().optional() });

/**
 * Send again: one unsent message (even one Riseline gave up on), or every unsent one of the
 * organization. The rows get a fresh day of automatic tries and a delivery job now; the answer
 * (202) says what was queued, and the Mail page follows the rows as they go.
 */
export const POST = route({ policy: "outbox.resend", body }, async ({ actor, body }) => {
  const queued = await db().transaction((tx) => requeueUnsentMail(tx, { organizationId: actor.organizationId, id: body.id }));
  if (body.id && !queued.length) throw new AppError("not_found", "No unsent message with that id.");
  return Response.json({ queued }, { status: 202 });
});
