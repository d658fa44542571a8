import { db } from "@/db/client";
import { route } from "@/lib/api/handler";
import { practiceCallsQuery } from "@/lib/practice/schemas";
import { listPracticeCalls } from "@/lib/practice/view";

export const dynamic = "force-dynamic";

/** GET /api/practice/calls[?apprenticeId=] — calls with match rates: every apprentice's for trainers, leads, owners; one's own otherwise. */
export const GET = route({ policy: "practice.read", query: practiceCallsQuery }, async ({ actor, query }) => listPracticeCalls(db(), actor, query));
