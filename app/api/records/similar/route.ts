import { z } from "zod";
import { db } from "@/db/client";
import { listSimilarNamesByOrganization } from "@/db/queries/similar-names";
import { route } from "@/lib/api/handler";

export const dynamic = "force-dynamic";

const similarQuerySchema = z.object({
  kind: z.enum(["customer", "site", "system"]),
  name: z.string().trim().min(1, "type a name").max(200),
  siteId: z.preprocess((v) => (v === "" ? undefined : v), z.string().uuid("siteId: not a site id").optional()),
});

/**
 * GET /api/records/similar?kind=site&name=Harbour%20Dental — { matches: [{ id, name, detail, score }] }:
 * the shop's records named like the one about to be created (pg_trgm), best first, at most five.
 */
export const GET = route({ policy: "record.similar", query: similarQuerySchema }, async ({ actor, query }) => ({
  matches: await listSimilarNamesByOrganization(db(), { organizationId: actor.organizationId, kind: query.kind, name: query.name, siteId: query.siteId ?? null }),
}));
