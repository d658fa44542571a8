import { db } from "@/db/client";
import { route } from "@/lib/api/handler";
import { loadOverlay, overlayQuery } from "@/lib/casebook/overlay";

export const dynamic = "force-dynamic";

/** GET /api/overlay?tests=id1,…,id8 — aligned curves and numbers; invisible tests left out with a note; 404 when none visible. */
export const GET = route({ policy: "overlay.read", query: overlayQuery }, async ({ actor, query }) => loadOverlay(db(), actor, query.tests));
