import { db } from "@/db/client";
import { route } from "@/lib/api/handler";
import { entryParams, pinCreateSchema } from "@/lib/casebook/schemas";
import { addPin } from "@/lib/casebook/service";

export const dynamic = "force-dynamic";

/** POST /api/casebook/:id/entries/:entryId/pins — { atSeconds, text } pinned on the curve (trainers). */
export const POST = route({ policy: "casebook.curate", params: entryParams, body: pinCreateSchema }, async ({ actor, params, body }) =>
  Response.json({ pin: await addPin(db(), actor, params.id, params.entryId, body) }, { status: 201 }),
);
