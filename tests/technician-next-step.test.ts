/**
 * What the technician and the lead see first (product rule): a sent-back test's request in the
 * lead's words for the home card; the queue's "waiting" age from when the test entered the queue,
 * also for the demo month (its events dated on the tests' days). Real PostgreSQL; invented data.
 */
import { describe, expect, it } from "vitest";
import { sql } from "drizzle-orm";
import { db } from "@/db/client";
import { testEvents } from "@/db/schema";
import { listSentBackRequestsByTechnician } from "@/db/queries/home";
import { backdateSeededTestEventsByOrganization } from "@/db/queries/seed-history";
import { countTestsWaitingReviewByOrganization } from "@/db/queries/review";
import { POST as reviewPost } from "@/app/api/vacuum-tests/[id]/review/route";
import { GET as queueGet } from "@/app/api/review/route";
import { routeNewTestToReview } from "@/lib/review/auto";
import { appRequest, routeParams } from "./helpers/members";
import { crewForFile, jsonInit } from "./helpers/crew";
import { jobRunnerForFile } from "./helpers/jobs";
import { seedTest } from "./helpers/seed-test";

const crew = crewForFile();
jobRunnerForFile();

describe("the technician's home card and the lead's queue ages (product rule)", () => {
  it("lists the technician's sent-back tests with the lead's latest request and name; not another technician's, not after resubmitting", async () => {
    const org = crew.owner.organizationId;
    const id = await seedTest(crew.technician, { verdict: "leak", title: "Harbor Lane walk-in" });
    await reviewPost(appRequest(`/api/tests/${id}/review`, jsonInit(crew.lead, { action: "send_back", note: "Replace the core caps and hold 15 minutes." })), routeParams({ id }));
    const mine = await listSentBackRequestsByTechnician(db(), { organizationId: org, userId: crew.technician.userId, limit: 5 });
    expect(mine.find((r) => r.testId === id)).toMatchObject({ title: "Harbor Lane walk-in", request: "Replace the core caps and hold 15 minutes.", by: crew.lead.name });
    expect((await listSentBackRequestsByTechnician(db(), { organizationId: org, userId: crew.apprentice.userId, limit: 5 })).some((r) => r.testId === id)).toBe(false);
    await reviewPost(appRequest(`/api/tests/${id}/review`, jsonInit(crew.technician, { action: "resubmit", note: "Done" })), routeParams({ id }));
    expect((await listSentBackRequestsByTechnician(db(), { organizationId: org, userId: crew.technician.userId, limit: 5 })).some((r) => r.testId === id)).toBe(false);
  });

  it("a demo test from 12 days ago waits since its own day once the seed dates its routing event (20 min after the test); a later review step keeps its own time", async () => {
    const org = crew.owner.organizationId;
    const testedAt = new Date(Date.now() - 12 * 86_400_000);
    const id = await seedTest(crew.technician, { verdict: "leak", title: "Old demo leak", testedAt });
    await routeNewTestToReview(db(), { organizationId: org, testId: id, actorId: null });
    const res = await queueGet(appRequest("/api/review", { as: crew.lead }));
    const before = (await res.json()).items.find((i: { id: string }) => i.id === id);
    expect(Date.now() - Date.parse(before.waitingSince)).toBeLessThan(60_000);

    const moved = await backdateSeededTestEventsByOrganization(db(), { organizationId: org, minutesAfterTest: 20 });
    expect(moved).toBeGreaterThanOrEqual(1);
    const after = (await (await queueGet(appRequest("/api/review", { as: crew.lead }))).json()).items.find((i: { id: string }) => i.id === id);
    expect(Date.parse(after.waitingSince)).toBe(testedAt.getTime() + 20 * 60_000);

    await reviewPost(appRequest(`/api/tests/${id}/review`, jsonInit(crew.lead, { action: "send_back", note: "Hold longer." })), routeParams({ id }));
    await backdateSeededTestEventsByOrganization(db(), { organizationId: org, minutesAfterTest: 20 });
    const [sent] = await db().select({ at: testEvents.createdAt }).from(testEvents).where(sql`${testEvents.testId} = ${id} and ${testEvents.kind} = 'sent_back'`);
    expect(Date.now() - sent.at.getTime()).toBeLessThan(60_000);
  });

  it("the lead's attention count is the shop's review queue, not the lead's own tests", async () => {
    const org = crew.owner.organizationId;
    const a = await seedTest(crew.technician, { verdict: "leak" });
    const b = await seedTest(crew.apprentice, { verdict: "moisture" });
    for (const id of [a, b]) await routeNewTestToReview(db(), { organizationId: org, testId: id, actorId: null });
    const n = await countTestsWaitingReviewByOrganization(db(), { viewer: { organizationId: org, userId: crew.lead.userId, role: "lead" } });
    const [direct] = await db().execute<{ n: number }>(sql`select count(*)::int as n from vacuum_tests where organization_id = ${org} and status = 'waiting_review'`).then((r) => r.rows);
    expect(n).toBe(direct.n);
    expect(n).toBeGreaterThanOrEqual(2);
  });
});
