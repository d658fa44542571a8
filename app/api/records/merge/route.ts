import { z } from "zod";
import { db } from "@/db/client";
import { mergeDuplicateRecord } from "@/lib/records/merge";
import { route } from "@/lib/api/handler";

const mergeSchema = z.object({
  kind: z.enum(["customer", "site", "system"]),
  fromId: z.string().uuid("fromId: not a record id"),
  intoId: z.string().uuid("intoId: not a record id"),
});

/** POST /api/records/merge — a duplicate customer, site or system merged into the one kept: { kind, intoId, moved }. */
export const POST = route({ policy: "record.merge", body: mergeSchema }, async ({ actor, body }) =>
  mergeDuplicateRecord(db(), { organizationId: actor.organizationId, kind: body.kind, fromId: body.fromId, intoId: body.intoId }),
);
