import { db } from "@/db/client";
import { route } from "@/lib/api/handler";
import { pinParams } from "@/lib/casebook/schemas";
import { removePin } from "@/lib/casebook/service";

export const dynamic = "force-dynamic";

/** DELETE /api/casebook/:id/entries/:entryId/pins/:pinId (trainers). */
export const DELETE = route({ policy: "casebook.curate", params: pinParams }, async ({ actor, params }) => removePin(db(), actor, params.id, params.entryId, params.pinId));
