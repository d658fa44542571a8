/** What the home page tells a member first: the tests sent back to them, with the lead's words. */
import { and, desc, eq, sql } from "drizzle-orm";
import type { Db } from "@/db/client";
import { sites, testEvents, user, vacuumTests } from "@/db/schema";

export interface SentBackRequest {
  testId: string;
  title: string;
  siteName: string | null;
  request: string | null;
  by: string | null;
  at: Date;
}

/** The member's own tests now sent back, newest request first, each with the lead's latest request. */
export async function listSentBackRequestsByTechnician(db: Db, params: { organizationId: string; userId: string; limit: number }): Promise<SentBackRequest[]> {
  const latest = db
    .selectDistinctOn([testEvents.testId], { testId: testEvents.testId, note: testEvents.note, actorId: testEvents.actorId, at: testEvents.createdAt })
    .from(testEvents)
    .where(and(eq(testEvents.organizationId, params.organizationId), eq(testEvents.kind, "sent_back")))
    .orderBy(testEvents.testId, desc(testEvents.createdAt))
    .as("latest");
  return db
    .select({ testId: vacuumTests.id, title: vacuumTests.title, siteName: sites.name, request: latest.note, by: user.name, at: sql<Date>`${latest.at}`.mapWith((v) => new Date(v)) })
    .from(vacuumTests)
    .innerJoin(latest, eq(latest.testId, vacuumTests.id))
    .leftJoin(user, eq(user.id, latest.actorId))
    .leftJoin(sites, and(eq(sites.id, vacuumTests.siteId), eq(sites.organizationId, vacuumTests.organizationId)))
    .where(and(eq(vacuumTests.organizationId, params.organizationId), eq(vacuumTests.createdById, params.userId), eq(vacuumTests.status, "sent_back")))
    .orderBy(desc(latest.at))
    .limit(params.limit);
}
