/**
 * The database itself keeps a test, its analyses, its site and its system inside one organization
 * and keeps verdicts and states to their declared words (migration 0010_house_constraints), even
 * when a query forgets its organization scope. Real PostgreSQL; rows written with plain SQL so
 * only the constraints stand between a bad write and the table.
 */
import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { sql } from "drizzle-orm";
import { db } from "@/db/client";
import { createSite, createSystem } from "@/db/queries/records";
import { createShop, type TestMember } from "./helpers/members";
import { seedTest } from "./helpers/seed-test";

/** The PostgreSQL error code and constraint of a refused write (drizzle wraps the driver's error). */
async function refusal(run: () => Promise<unknown>): Promise<{ code: string; constraint: string }> {
  try {
    await run();
  } catch (err) {
    const e = (err as { cause?: { code?: string; constraint?: string } }).cause ?? (err as { code?: string; constraint?: string });
    return { code: e.code ?? "", constraint: e.constraint ?? "" };
  }
  throw new Error("the database accepted the write");
}

async function currentAnalysisOf(testId: string): Promise<string> {
  const r = await db().execute(sql`SELECT current_analysis_id AS id FROM vacuum_tests WHERE id = ${testId}`);
  return String(r.rows[0].id);
}

let a: TestMember;
let b: TestMember;
let siteA: string;
let testA: string;
let testB: string;
beforeAll(async () => {
  [a, b] = await Promise.all([createShop("Aspen Cooling"), createShop("Beech Heating")]);
  siteA = (await createSite(db(), { organizationId: a.organizationId, name: "Aspen depot" })).id;
  [testA, testB] = await Promise.all([seedTest(a, { siteId: siteA }), seedTest(b)]);
});

describe("one organization per record (PostgreSQL 15 §5.4.5 foreign keys on (organization_id, id))", () => {
  it("refuses a test of shop B at shop A's site, and a system of shop B at shop A's site", async () => {
    const test = await refusal(() => db().execute(sql`UPDATE vacuum_tests SET site_id = ${siteA} WHERE id = ${testB}`));
    expect(test).toEqual({ code: "23503", constraint: "vacuum_tests_site_fk" });
    const system = await refusal(() => createSystem(db(), { organizationId: b.organizationId, siteId: siteA, name: "Roof unit" }));
    expect(system).toEqual({ code: "23503", constraint: "systems_site_fk" });
  });

  it("refuses an analysis filed under shop B for shop A's test", async () => {
    const r = await refusal(() =>
      db().execute(sql`
        INSERT INTO analyses (organization_id, test_id, version, engine_version, options, profile, result, series, verdict, confidence, created_by_id)
        SELECT ${b.organizationId}, id, 99, 'x', '{}', '{}', '{}', '{"t":[],"p":[]}', 'pass', 1, ${b.userId} FROM vacuum_tests WHERE id = ${testA}`),
    );
    expect(r).toEqual({ code: "23503", constraint: "analyses_test_fk" });
  });

  it("refuses at commit a current analysis of another shop, and keeps the test's own", async () => {
    const own = await currentAnalysisOf(testB);
    const foreign = await currentAnalysisOf(testA);
    const r = await refusal(() => db().transaction(async (tx) => tx.execute(sql`UPDATE vacuum_tests SET current_analysis_id = ${foreign} WHERE id = ${testB}`)));
    expect(r).toEqual({ code: "23503", constraint: "vacuum_tests_current_analysis_fk" });
    expect(await currentAnalysisOf(testB)).toBe(own);
  });

  it("accepts a current analysis written before its row inside one transaction (the key is checked at commit)", async () => {
    const testId = randomUUID();
    const analysisId = randomUUID();
    await db().transaction(async (tx) => {
      await tx.execute(sql`INSERT INTO vacuum_tests (id, organization_id, created_by_id, title, source, current_analysis_id, verdict)
        VALUES (${testId}, ${b.organizationId}, ${b.userId}, 'Deferred key', 'typed', ${analysisId}, 'pass')`);
      await tx.execute(sql`INSERT INTO analyses (id, organization_id, test_id, version, engine_version, options, profile, result, series, verdict, confidence, created_by_id)
        VALUES (${analysisId}, ${b.organizationId}, ${testId}, 1, 'x', '{}', '{}', '{}', '{"t":[],"p":[]}', 'pass', 1, ${b.userId})`);
    });
    expect(await currentAnalysisOf(testId)).toBe(analysisId);
  });

  it("empties only the site column when the site goes, so the test keeps its organization", async () => {
    const site = (await createSite(db(), { organizationId: a.organizationId, name: "Closing branch" })).id;
    const testId = await seedTest(a, { siteId: site });
    await db().execute(sql`DELETE FROM sites WHERE id = ${site}`);
    const r = await db().execute(sql`SELECT organization_id, site_id FROM vacuum_tests WHERE id = ${testId}`);
    expect(r.rows[0]).toEqual({ organization_id: a.organizationId, site_id: null });
  });
});

describe("verdicts and states in their declared words (CHECK constraints; lists in db/vocabulary.ts)", () => {
  it("refuses a verdict the engine never gives, on the test and on the analysis", async () => {
    expect(await refusal(() => db().execute(sql`UPDATE vacuum_tests SET verdict = 'passed' WHERE id = ${testA}`))).toEqual({ code: "23514", constraint: "vacuum_tests_verdict_check" });
    expect(await refusal(() => db().execute(sql`UPDATE analyses SET verdict = 'ok' WHERE test_id = ${testA}`))).toEqual({ code: "23514", constraint: "analyses_verdict_check" });
  });

  it("refuses a review state that does not exist, and still takes a test with no verdict yet", async () => {
    expect(await refusal(() => db().execute(sql`UPDATE vacuum_tests SET status = 'approved' WHERE id = ${testA}`))).toEqual({ code: "23514", constraint: "vacuum_tests_status_check" });
    await db().execute(sql`UPDATE vacuum_tests SET verdict = NULL WHERE id = ${testB}`);
    const r = await db().execute(sql`SELECT verdict FROM vacuum_tests WHERE id = ${testB}`);
    expect(r.rows[0].verdict).toBeNull();
  });
});
