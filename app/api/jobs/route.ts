import { db } from "@/db/client";
import { getMembershipByUser } from "@/db/queries/members";
import { createJob, getSiteById, getSystemById, listJobsByOrganization } from "@/db/queries/records";
import { route } from "@/lib/api/handler";
import { AppError } from "@/lib/errors";
import { createJobSchema, jobsQuerySchema } from "@/lib/vacuum-tests/records-schemas";

export const dynamic = "force-dynamic";

/** GET /api/jobs?siteId= — { items: Job[] }, newest visit first. */
export const GET = route({ policy: "record.read", query: jobsQuerySchema }, async ({ actor, query }) => ({
  items: await listJobsByOrganization(db(), { organizationId: actor.organizationId, siteId: query.siteId }),
}));

/** POST /api/jobs — 201 { job }; site, system and technician must belong to the organization. */
export const POST = route({ policy: "record.create", body: createJobSchema }, async ({ actor, body }) => {
  const organizationId = actor.organizationId;
  const job = await db().transaction(async (tx) => {
    if (body.siteId && !(await getSiteById(tx, { organizationId, siteId: body.siteId })))
      throw new AppError("invalid_input", "siteId: no such site in your organization", { field: "siteId" });
    if (body.systemId) {
      const system = await getSystemById(tx, { organizationId, systemId: body.systemId });
      if (!system) throw new AppError("invalid_input", "systemId: no such system in your organization", { field: "systemId" });
      if (body.siteId && system.siteId !== body.siteId) throw new AppError("invalid_input", "systemId: that system is at another site", { field: "systemId" });
    }
    if (body.technicianId && !(await getMembershipByUser(tx, { organizationId, userId: body.technicianId })))
      throw new AppError("invalid_input", "technicianId: not a member of your organization", { field: "technicianId" });
    return createJob(tx, { organizationId, ...body, technicianId: body.technicianId ?? actor.userId });
  });
  return Response.json({ job }, { status: 201 });
});
