import { z } from "zod";
import { db } from "@/db/client";
import { listOutboxMailByOrganization } from "@/db/queries/outbox";
import { MAIL_STATUSES } from "@/db/schema";
import { route } from "@/lib/api/handler";

const query = z.object({
  status: z.preprocess((v) => (v === "" ? undefined : v), z.enum(MAIL_STATUSES).optional()),
  testId: z.preprocess((v) => (v === "" ? undefined : v), z.string().uuid().optional()),
});

/** The organization's outgoing mail (no bodies), for leads and owners to see what did not go. */
export const GET = route({ policy: "outbox.read", query }, async ({ actor, query }) => {
  const rows = await listOutboxMailByOrganization(db(), { organizationId: actor.organizationId, status: query.status, testId: query.testId, limit: 200 });
  return {
    mail: rows.map((r) => ({ ...r, createdAt: r.createdAt.toISOString(), sentAt: r.sentAt?.toISOString() ?? null, nextAttemptAt: r.nextAttemptAt?.toISOString() ?? null })),
  };
});
