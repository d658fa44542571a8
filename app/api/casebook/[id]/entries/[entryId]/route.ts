import { db } from "@/db/client";
import { route } from "@/lib/api/handler";
import { entryParams, entryUpdateSchema } from "@/lib/casebook/schemas";
import { removeEntry, updateEntry } from "@/lib/casebook/service";

export const dynamic = "force-dynamic";

/** PATCH /api/casebook/:id/entries/:entryId — title, notes, order (trainers). */
export const PATCH = route({ policy: "casebook.curate", params: entryParams, body: entryUpdateSchema }, async ({ actor, params, body }) => ({
  entry: await updateEntry(db(), actor, params.id, params.entryId, body),
}));

/** DELETE /api/casebook/:id/entries/:entryId (trainers). */
export const DELETE = route({ policy: "casebook.curate", params: entryParams }, async ({ actor, params }) => removeEntry(db(), actor, params.id, params.entryId));
