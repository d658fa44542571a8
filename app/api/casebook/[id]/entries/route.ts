import { db } from "@/db/client";
import { route } from "@/lib/api/handler";
import { collectionParams, entryCreateSchema } from "@/lib/casebook/schemas";
import { addEntry } from "@/lib/casebook/service";

export const dynamic = "force-dynamic";

/** POST /api/casebook/:id/entries — add a test with a title and notes (trainers). */
export const POST = route({ policy: "casebook.curate", params: collectionParams, body: entryCreateSchema }, async ({ actor, params, body }) =>
  Response.json({ entry: await addEntry(db(), actor, params.id, body) }, { status: 201 }),
);
