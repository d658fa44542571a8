import { db } from "@/db/client";
import { createCustomer, createSite, getCustomerById, listSitesByOrganization } from "@/db/queries/records";
import { route } from "@/lib/api/handler";
import { AppError } from "@/lib/errors";
import { createSiteSchema } from "@/lib/vacuum-tests/records-schemas";

export const dynamic = "force-dynamic";

/** GET /api/sites — { items: [{ id, name, address, customerId, customerName, createdAt }] }. */
export const GET = route({ policy: "record.read" }, async ({ actor }) => ({
  items: await listSitesByOrganization(db(), { organizationId: actor.organizationId }),
}));

/** POST /api/sites — 201 { site }; a new customer may be created in the same transaction. */
export const POST = route({ policy: "record.create", body: createSiteSchema }, async ({ actor, body }) => {
  const organizationId = actor.organizationId;
  const site = await db().transaction(async (tx) => {
    let customerId = body.customerId ?? null;
    if (customerId && !(await getCustomerById(tx, { organizationId, customerId })))
      throw new AppError("invalid_input", "customerId: no such customer in your organization", { field: "customerId" });
    if (body.newCustomerName) customerId = (await createCustomer(tx, { organizationId, name: body.newCustomerName })).id;
    return createSite(tx, { organizationId, name: body.name, address: body.address ?? null, customerId });
  });
  return Response.json({ site }, { status: 201 });
});
