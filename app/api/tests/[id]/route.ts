import { db } from "@/db/client";
import { route, uuidParam } from "@/lib/api/handler";
import { loadTestDetail } from "@/lib/tests/read";

export const dynamic = "force-dynamic";

/** GET /api/tests/:id — { test, analysis, series, history, upload }; 404 unless visible. */
export const GET = route({ permission: "member", params: uuidParam }, async ({ actor, params }) => loadTestDetail(db(), actor, params.id));
