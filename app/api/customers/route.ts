import { z } from "zod";
import { db } from "@/db/client";
import { createCustomer, listCustomersByOrganization } from "@/db/queries/records";
import { route } from "@/lib/api/handler";
import { canSeeCustomerContact } from "@/lib/permissions";

export const dynamic = "force-dynamic";

const blank = (v: unknown) => (typeof v === "string" && v.trim() === "" ? null : v);
const customerSchema = z.object({
  name: z.string().trim().min(1, "give the customer a name").max(200),
  email: z.preprocess(blank, z.string().trim().email("not an e-mail address").max(320).nullable().optional()),
  phone: z.preprocess(blank, z.string().trim().max(40).nullable().optional()),
});

/** GET /api/customers — { items } of the organization, by name; e-mail and phone only for roles that manage records. */
export const GET = route({ policy: "record.read" }, async ({ actor }) => ({
  items: await listCustomersByOrganization(db(), { organizationId: actor.organizationId, withContact: canSeeCustomerContact(actor.role) }),
}));

/** POST /api/customers — 201 { customer }. */
export const POST = route({ policy: "record.create", body: customerSchema }, async ({ actor, body }) => {
  const customer = await createCustomer(db(), { organizationId: actor.organizationId, ...body });
  return Response.json({ customer }, { status: 201 });
});
