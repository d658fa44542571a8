import { db } from "@/db/client";
import { getPressureTestById } from "@/db/queries/pressure-tests";
import { route } from "@/lib/api/handler";
import { AppError } from "@/lib/errors";
import { pressureTestParams } from "@/lib/pressure/schemas";
import { viewerOf } from "@/lib/rigs/service";

export const GET = route({ policy: "pressureTest.read", params: pressureTestParams }, async ({ actor, params }) => {
  const row = await getPressureTestById(db(), { viewer: viewerOf(actor), pressureTestId: params.id });
  if (!row) throw new AppError("not_found", "No such pressure test.");
  return { test: row.test, createdByName: row.createdByName };
});
