import { db } from "@/db/client";
import { createSystem, getSiteById, listSystemsByOrganization } from "@/db/queries/records";
import { route } from "@/lib/api/handler";
import { AppError } from "@/lib/errors";
import { createSystemSchema, systemsQuerySchema } from "@/lib/vacuum-tests/records-schemas";

export const dynamic = "force-dynamic";

/** GET /api/systems?siteId= — { items: System[] } of the organization (of one site when given). */
export const GET = route({ policy: "record.read", query: systemsQuerySchema }, async ({ actor, query }) => ({
  items: await listSystemsByOrganization(db(), { organizationId: actor.organizationId, siteId: query.siteId }),
}));

/** POST /api/systems — 201 { system } at a site of the organization. */
export const POST = route({ policy: "record.create", body: createSystemSchema }, async ({ actor, body }) => {
  const organizationId = actor.organizationId;
  const system = await db().transaction(async (tx) => {
    if (!(await getSiteById(tx, { organizationId, siteId: body.siteId })))
      throw new AppError("invalid_input", "siteId: no such site in your organization", { field: "siteId" });
    return createSystem(tx, { organizationId, ...body });
  });
  return Response.json({ system }, { status: 201 });
});
