import { db } from "@/db/client";
import { route } from "@/lib/api/handler";
import { collectionParams, collectionUpdateSchema } from "@/lib/casebook/schemas";
import { loadCollection, removeCollection, updateCollection } from "@/lib/casebook/service";

export const dynamic = "force-dynamic";

/** GET /api/casebook/:id — the collection with its entries, curves and pins (details stripped by role). */
export const GET = route({ policy: "casebook.read", params: collectionParams }, async ({ actor, params }) => loadCollection(db(), actor, params.id));

/** PATCH /api/casebook/:id — rename or describe (trainers). */
export const PATCH = route({ policy: "casebook.curate", params: collectionParams, body: collectionUpdateSchema }, async ({ actor, params, body }) => ({
  collection: await updateCollection(db(), actor, params.id, body),
}));

/** DELETE /api/casebook/:id (trainers); the tests themselves stay. */
export const DELETE = route({ policy: "casebook.curate", params: collectionParams }, async ({ actor, params }) => removeCollection(db(), actor, params.id));
