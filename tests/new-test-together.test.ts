/**
 * insertNewTestTogether: a new test and its upload, analysis, findings, audit event, e-mail and
 * Idempotency-Key in one statement, against the real PostgreSQL. The atomicity it relies on is
 * PostgreSQL's own (manual, §7.8.4 "Data-Modifying Statements in WITH": every sub-statement runs
 * to completion, and an error in any of them aborts the whole statement).
 */
import { beforeAll, describe, expect, it } from "vitest";
import { randomUUID } from "node:crypto";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { analyses, findings, idempotencyKeys, mailOutbox, testEvents, uploads, vacuumTests } from "@/db/schema";
import { analysisRowsOf } from "@/db/queries/analyses";
import { insertNewTestTogether, isIdempotencyKeyTaken, type NewVacuumTestRows } from "@/db/queries/vacuum-tests";
import { createShop, type TestMember } from "./helpers/members";
import { seededResult, seededSeries } from "./helpers/seed-test";

function rowsFor(who: TestMember, opts: { key?: string; objectKey?: string; findingAnalysisId?: string } = {}): NewVacuumTestRows {
  const testId = randomUUID();
  const analysisId = randomUUID();
  const org = who.organizationId;
  const a = analysisRowsOf({
    id: analysisId, organizationId: org, testId, version: 1, options: {}, result: seededResult("leak"), series: seededSeries("leak"), createdById: who.userId,
  });
  return {
    test: {
      id: testId, organizationId: org, createdById: who.userId, title: "Together", source: "file", verdict: "leak", currentAnalysisId: analysisId, status: "waiting_review",
    },
    upload: { organizationId: org, testId, objectKey: opts.objectKey ?? `orgs/${org}/tests/${testId}/raw/log.csv`, sha256: "0".repeat(64), sizeBytes: 10, filename: "log.csv", contentType: "text/csv" },
    analysis: a.analysis,
    findings: a.findings.map((f) => ({ ...f, analysisId: opts.findingAnalysisId ?? f.analysisId })),
    events: [{ organizationId: org, testId, actorId: null, kind: "review_requested", fromStatus: "submitted", toStatus: "waiting_review", note: "Automatic." }],
    mails: ["a@example.test", "b@example.test"].map((to) => ({ id: randomUUID(), organizationId: org, testId, to, subject: "Review", text: "t", html: "<p>t</p>" })),
    idempotencyKey: opts.key ? { organizationId: org, key: opts.key, userId: who.userId, testId } : null,
  };
}

async function rowsOfTest(testId: string) {
  const d = db();
  return {
    tests: (await d.select().from(vacuumTests).where(eq(vacuumTests.id, testId))).length,
    uploads: (await d.select().from(uploads).where(eq(uploads.testId, testId))).length,
    analyses: (await d.select().from(analyses).where(eq(analyses.testId, testId))).length,
    findings: (await d.select().from(findings).where(eq(findings.testId, testId))).length,
    events: (await d.select().from(testEvents).where(eq(testEvents.testId, testId))).length,
    mails: (await d.select().from(mailOutbox).where(eq(mailOutbox.testId, testId))).length,
    keys: (await d.select().from(idempotencyKeys).where(eq(idempotencyKeys.testId, testId))).length,
  };
}

describe("insertNewTestTogether (one statement for a new test's rows)", () => {
  let who: TestMember;
  beforeAll(async () => {
    who = await createShop();
  });

  it("writes the test and every row with it, and returns the test as a SELECT reads it (PostgreSQL manual §7.8.4)", async () => {
    const rows = rowsFor(who, { key: randomUUID() });
    const inserted = await insertNewTestTogether(db(), rows);
    const [read] = await db().select().from(vacuumTests).where(eq(vacuumTests.id, rows.test.id));
    expect(inserted).toEqual(read);
    expect(inserted.status).toBe("waiting_review");
    expect(await rowsOfTest(rows.test.id)).toEqual({ tests: 1, uploads: 1, analyses: 1, findings: 1, events: 1, mails: 2, keys: 1 });
    const mailIds = (await db().select({ id: mailOutbox.id }).from(mailOutbox).where(eq(mailOutbox.testId, rows.test.id))).map((m) => m.id).sort();
    expect(mailIds).toEqual(rows.mails.map((m) => m.id).sort());
  });

  it("leaves no row at all when one of them breaks a foreign key checked at the end of the statement (PostgreSQL manual §7.8.4)", async () => {
    const rows = rowsFor(who, { findingAnalysisId: randomUUID() }); // a finding of an analysis that does not exist
    await expect(insertNewTestTogether(db(), rows)).rejects.toThrow();
    expect(await rowsOfTest(rows.test.id)).toEqual({ tests: 0, uploads: 0, analyses: 0, findings: 0, events: 0, mails: 0, keys: 0 });
  });

  it("fails a second test with a taken Idempotency-Key as a key conflict and writes none of it; another unique violation is not one", async () => {
    const key = randomUUID();
    const first = rowsFor(who, { key });
    await insertNewTestTogether(db(), first);
    const second = rowsFor(who, { key });
    const err = await insertNewTestTogether(db(), second).then(() => null, (e: unknown) => e);
    expect(isIdempotencyKeyTaken(err)).toBe(true);
    expect(await rowsOfTest(second.test.id)).toEqual({ tests: 0, uploads: 0, analyses: 0, findings: 0, events: 0, mails: 0, keys: 0 });

    const sameFile = rowsFor(who, { objectKey: first.upload.objectKey }); // uploads.object_key is unique too
    const other = await insertNewTestTogether(db(), sameFile).then(() => null, (e: unknown) => e);
    expect(other).not.toBeNull();
    expect(isIdempotencyKeyTaken(other)).toBe(false);
    expect(await rowsOfTest(sameFile.test.id)).toEqual({ tests: 0, uploads: 0, analyses: 0, findings: 0, events: 0, mails: 0, keys: 0 });
  });
});
