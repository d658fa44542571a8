import { describe, expect, it } from "vitest";
import { sql } from "drizzle-orm";
import { GET } from "@/app/api/health/route";
import { db } from "@/db/client";

describe("health and migrations", () => {
  it("reports the database and the bucket as reachable", async () => {
    const res = await GET(new Request("http://127.0.0.1/api/health"));
    expect(res.status).toBe(200);
    expect(await res.json()).toEqual({ ok: true, database: "ok", bucket: "ok", engine: "not started", jobs: "not started" });
  });

  it("has every table the migrations create", async () => {
    const rows = await db().execute<{ table_name: string }>(
      sql`select table_name from information_schema.tables where table_schema = 'public'`,
    );
    const names = rows.rows.map((r) => r.table_name);
    for (const t of ["user", "session", "organization", "member", "invitation", "vacuum_tests", "uploads", "analyses", "findings"]) {
      expect(names).toContain(t);
    }
  });
});
