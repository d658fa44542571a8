import { sql } from "drizzle-orm";
import { db } from "@/db/client";
import { publicRoute } from "@/lib/api/handler";
import { bucketReachable } from "@/lib/storage";
import { engineMode } from "@/lib/tests/engine-pool";

export const dynamic = "force-dynamic";

async function databaseReachable(): Promise<boolean> {
  try {
    await db().execute(sql`select 1`);
    return true;
  } catch {
    return false;
  }
}

/** GET /api/health — both stores (they decide `ok`), and where the analysis engine runs. */
export const GET = publicRoute({}, async () => {
  const [database, bucket] = await Promise.all([databaseReachable(), bucketReachable()]);
  const ok = database && bucket;
  return Response.json(
    { ok, database: database ? "ok" : "unreachable", bucket: bucket ? "ok" : "unreachable", engine: engineMode() },
    { status: ok ? 200 : 503 },
  );
});
