import { db } from "@/db/client";
import { route } from "@/lib/api/handler";
import { collectionCreateSchema } from "@/lib/casebook/schemas";
import { createCollection, listCollections } from "@/lib/casebook/service";

export const dynamic = "force-dynamic";

/** GET /api/casebook — the organization's collections (every member reads the casebook). */
export const GET = route({ policy: "casebook.read" }, async ({ actor }) => ({ collections: await listCollections(db(), actor) }));

/** POST /api/casebook — a new collection (trainers). */
export const POST = route({ policy: "casebook.curate", body: collectionCreateSchema }, async ({ actor, body }) =>
  Response.json({ collection: await createCollection(db(), actor, body) }, { status: 201 }),
);
