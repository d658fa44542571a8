import { CHECK_TIMEOUT_MS, databaseReachable } from "@/lib/health/database";
import { publicRoute } from "@/lib/api/handler";
import { bucketReachable } from "@/lib/storage";
import { engineMode } from "@/lib/engine/pool";
import { jobRunnerState } from "@/lib/jobs/runner";
import { env } from "@/lib/env";

export const dynamic = "force-dynamic";

/**
 * GET /api/health — both stores (they decide `ok`), where the analysis engine runs, and whether this
 * server runs the background jobs ("running", "starting", "not started", or "worker" when
 * JOBS_IN_APP=off leaves them to `npm run worker`).
 */
export const GET = publicRoute({}, async () => {
  const [database, bucket] = await Promise.all([databaseReachable(), bucketReachable(CHECK_TIMEOUT_MS)]);
  const ok = database && bucket;
  return Response.json(
    {
      ok,
      database: database ? "ok" : "unreachable",
      bucket: bucket ? "ok" : "unreachable",
      engine: engineMode(),
      jobs: env().JOBS_IN_APP === "off" ? "worker" : jobRunnerState(),
    },
    { status: ok ? 200 : 503 },
  );
});
