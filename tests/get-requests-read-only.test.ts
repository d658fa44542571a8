/**
 * A GET never writes (RFC 9110 §9.2.1: GET is a safe method; a retried or prefetched read must not
 * change anything): every GET route of the role matrix, called by every role, an outsider and
 * anonymous, leaves every table of the application exactly as it was. Sign-in bookkeeping
 * (better-auth's session rows) is left out: it belongs to the session, not to the request.
 */
import { sql } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { ROLES } from "@/lib/permissions";
import type { Probe } from "./role-matrix/expect";
import { RECORD_PROBES } from "./role-matrix/probes-records";
import { TEST_PROBES } from "./role-matrix/probes-vacuum-tests";
import { buildWorld, type World } from "./role-matrix/world";

const READS: Probe[] = [...TEST_PROBES, ...RECORD_PROBES].filter((p) => p.route.startsWith("GET "));
const NOT_THE_REQUESTS = new Set(["session", "verification", "rate_limit", "rateLimit"]);

/** Per table: its row count and a digest of every row, so any insert, update or delete shows. */
async function snapshot(): Promise<Record<string, string>> {
  const tables = await db().execute<{ name: string }>(sql`select tablename as name from pg_tables where schemaname = 'public' order by tablename`);
  const out: Record<string, string> = {};
  for (const { name } of tables.rows) {
    if (NOT_THE_REQUESTS.has(name)) continue;
    const q = sql.raw(`select count(*)::int || ':' || coalesce(md5(string_agg(t::text, '|' order by t::text)), '') as digest from "${name.replace(/"/g, "")}" t`);
    out[name] = (await db().execute<{ digest: string }>(q)).rows[0].digest;
  }
  return out;
}

let w: World;
beforeAll(async () => {
  w = await buildWorld();
}, 120_000);

describe("GET requests are safe (RFC 9110 §9.2.1)", () => {
  it("every GET route, for every role, an outsider and anonymous, writes nothing", async () => {
    expect(READS.length).toBeGreaterThan(20);
    expect(READS.map((p) => p.route)).toContain("GET /api/review");
    const before = await snapshot();
    for (const probe of READS) {
      for (const role of ROLES) await probe.call(w.crew[role], w);
      await probe.call(w.outsider, w);
      await probe.call(null, w);
    }
    const after = await snapshot();
    const changed = Object.keys(before).filter((t) => before[t] !== after[t]);
    expect(changed).toEqual([]);
    expect(Object.keys(after)).toEqual(Object.keys(before));
  }, 120_000);
});
