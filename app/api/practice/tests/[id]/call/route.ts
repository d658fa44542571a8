import { db } from "@/db/client";
import { route, uuidParam } from "@/lib/api/handler";
import { practiceCallSchema } from "@/lib/practice/schemas";
import { recordPracticeCall } from "@/lib/practice/view";

export const dynamic = "force-dynamic";

/** POST /api/practice/tests/:id/call — { call, reason } by an apprentice; answers with the revealed analysis. 409 if already called. */
export const POST = route({ policy: "practice.call", params: uuidParam, body: practiceCallSchema }, async ({ actor, params, body }) =>
  Response.json(await recordPracticeCall(db(), actor, params.id, body), { status: 201 }),
);
