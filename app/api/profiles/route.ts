import { db } from "@/db/client";
import { listProfilesByOrganization } from "@/db/queries/profiles";
import { route } from "@/lib/api/handler";

export const dynamic = "force-dynamic";

/**
 * GET /api/profiles — { items: [{ id, name, targetMicrons, holdMinutes, limitMicrons,
 * leakRateMicronsPerMinute, isDefault }] }; with no profiles of its own, the organization sees the
 * engine's default as "Common practice (default)" with id null.
 */
export const GET = route({ policy: "profile.list" }, async ({ actor }) => ({
  items: await listProfilesByOrganization(db(), { organizationId: actor.organizationId }),
}));
