import { db } from "@/db/client";
import { getCustomerById, listCustomersByOrganization, listSitesByOrganization } from "@/db/queries/records";
import { route, uuidParam } from "@/lib/api/handler";
import { AppError } from "@/lib/errors";
import { canSeeCustomerContact } from "@/lib/permissions";

/** GET /api/customers/:id — { customer, sites } (404 outside the organization); contact details as in GET /api/customers. */
export const GET = route({ policy: "record.read", params: uuidParam }, async ({ actor, params }) => {
  const org = actor.organizationId;
  const found = await getCustomerById(db(), { organizationId: org, customerId: params.id });
  if (!found) throw new AppError("not_found", "No such customer.");
  const [all, sites] = await Promise.all([listCustomersByOrganization(db(), { organizationId: org, withContact: canSeeCustomerContact(actor.role) }), listSitesByOrganization(db(), { organizationId: org })]);
  return { customer: all.find((c) => c.id === found.id) ?? { ...found, email: null, phone: null }, sites: sites.filter((s) => s.customerId === found.id) };
});
