import { db } from "@/db/client";
import { route, uuidParam } from "@/lib/api/handler";
import { loadPracticeTest } from "@/lib/practice/view";

export const dynamic = "force-dynamic";

/** GET /api/practice/tests/:id — the curve; the analysis only once the apprentice has made their call. */
export const GET = route({ policy: "practice.read", params: uuidParam }, async ({ actor, params }) => loadPracticeTest(db(), actor, params.id));
