import { db } from "@/db/client";
import { createPressureTest, getPressureTestByKey, isJobOfOrganization, listPressureTestsByViewer } from "@/db/queries/pressure-tests";
import { route } from "@/lib/api/handler";
import { AppError } from "@/lib/errors";
import { evaluatePressureTest } from "@/lib/engine/door";
import { pressureTestCreateSchema, pressureTestListQuery } from "@/lib/pressure/schemas";
import { viewerOf } from "@/lib/rigs/service";
import { assertSameRequest, requestFingerprint } from "@/lib/vacuum-tests/idempotency";
import { idempotencyKeySchema, parseInput } from "@/lib/vacuum-tests/schemas";

/** Nitrogen tests the caller may see (same rule as vacuum tests), optionally for one job. */
export const GET = route({ policy: "pressureTest.list", query: pressureTestListQuery }, async ({ actor, query }) => {
  return { items: await listPressureTestsByViewer(db(), { viewer: viewerOf(actor), jobId: query.jobId }) };
});

/**
 * Record a nitrogen standing-pressure test from typed readings or a logger CSV; answers with the
 * verdict worked out. A test any reading of which went above the rated test pressure is saved only
 * with `overPressureAcknowledged: true`, and the record keeps who acknowledged it and when.
 * An Idempotency-Key is honoured as on the other creating routes (lib/vacuum-tests/idempotency.ts):
 * a retry with the same key and request answers 200 with the record already made, the same key
 * with another request is a 422, and two concurrent twins make one record.
 */
export const POST = route({ policy: "pressureTest.record", body: pressureTestCreateSchema, maxJsonBytes: 9 * 1024 * 1024 }, async ({ req, actor, body }) => {
  const rawKey = req.headers.get("idempotency-key");
  const idempotencyKey = rawKey === null ? null : parseInput(idempotencyKeySchema, rawKey, "Idempotency-Key");
  const fingerprint = requestFingerprint("POST /api/pressure-tests", { body });
  const keyOf = { organizationId: actor.organizationId, userId: actor.userId, key: idempotencyKey ?? "" };
  const replay = async () => {
    const spent = idempotencyKey ? await getPressureTestByKey(db(), keyOf) : null;
    if (!spent) return null;
    assertSameRequest({ testId: spent.test.id, analysisId: null, requestFingerprint: spent.requestFingerprint }, fingerprint);
    return Response.json({ test: spent.test, result: spent.test.result, assumptions: spent.test.assumptions ?? [] }, { status: 200 });
  };
  const earlier = await replay();
  if (earlier) return earlier;
  if (body.jobId && !(await isJobOfOrganization(db(), { organizationId: actor.organizationId, jobId: body.jobId })))
    throw new AppError("invalid_input", "jobId: no such job in this shop");
  const evaluated = await evaluatePressureTest(body);
  const { result } = evaluated;
  if (result.overPressure && body.overPressureAcknowledged !== true)
    throw new AppError("invalid_input", `overPressureAcknowledged: ${result.warnings.find((w) => w.code === "above_rated_pressure")?.message ?? "a reading is above the rated test pressure."} Saving this record needs your acknowledgement.`, {
      field: "overPressureAcknowledged",
      reason: "over_pressure_not_acknowledged",
      highest: result.overPressure.highest,
      ratedGauge: result.overPressure.ratedGauge,
    });
  const now = new Date();
  const row = await createPressureTest(db(), {
    organizationId: actor.organizationId,
    createdById: actor.userId,
    jobId: body.jobId ?? null,
    title: body.title || "Nitrogen standing-pressure test",
    source: body.source,
    unit: evaluated.unit,
    temperatureUnit: evaluated.temperatureUnit,
    startPressure: evaluated.start.pressureGauge,
    startTemperature: evaluated.start.temperature,
    endPressure: evaluated.end.pressureGauge,
    endTemperature: evaluated.end.temperature,
    atmosphereAbs: result.atmosphereAbs,
    atmosphereSource: evaluated.atmosphereSource,
    elevationM: evaluated.elevationM,
    ratedTestPressure: body.ratedTestPressureGauge ?? null,
    gaugeResolution: body.gaugeResolution ?? null,
    durationSeconds: evaluated.durationSeconds,
    startedAt: evaluated.startedAt,
    endedAt: evaluated.endedAt,
    highestPressure: result.highest.pressureGauge,
    highestAtSeconds: result.highest.atSeconds,
    series: evaluated.series,
    verdict: result.verdict,
    result,
    assumptions: evaluated.assumptions,
    overPressureAcknowledgedAt: result.overPressure ? now : null,
    overPressureAcknowledgedById: result.overPressure ? actor.userId : null,
    notes: body.notes ?? null,
    testedAt: body.testedAt ? new Date(body.testedAt) : (evaluated.startedAt ?? now),
    idempotencyKey,
    requestFingerprint: idempotencyKey ? fingerprint : null,
  });
  if (!row) {
    // A concurrent twin with the same key made it first: answer with that one.
    const twin = await replay();
    if (twin) return twin;
    throw new AppError("conflict", "The same nitrogen test is being saved by another request; try again.");
  }
  return Response.json({ test: row, result, assumptions: evaluated.assumptions }, { status: 201 });
});
