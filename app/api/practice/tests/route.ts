import { db } from "@/db/client";
import { route } from "@/lib/api/handler";
import { listPracticeTests } from "@/lib/practice/view";

export const dynamic = "force-dynamic";

/** GET /api/practice/tests — practice tests the member can see, with whether they have called each (never the verdict). */
export const GET = route({ policy: "practice.read" }, async ({ actor }) => ({ tests: await listPracticeTests(db(), actor) }));
