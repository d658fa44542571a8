/**
 * For the demo seed only: the month's tests are uploaded in one go today, so their audit events
 * (submitted, routed into review) would all carry the seed's own time and every queue item would
 * say "waiting 8 min". The seed moves each such event to a few minutes after its test's time, as
 * if it had been recorded on the day; events that happened later (a review step) keep their time.
 */
import { sql } from "drizzle-orm";
import type { Db } from "@/db/client";

export async function backdateSeededTestEventsByOrganization(db: Db, params: { organizationId: string; minutesAfterTest: number }): Promise<number> {
  const res = await db.execute(sql`
    update test_events e
       set created_at = t.tested_at + make_interval(mins => ${params.minutesAfterTest})
      from vacuum_tests t
     where t.id = e.test_id
       and t.organization_id = e.organization_id
       and e.organization_id = ${params.organizationId}
       and e.kind in ('submitted', 'review_requested')
       and e.created_at > t.tested_at + make_interval(mins => ${params.minutesAfterTest})`);
  return res.rowCount ?? 0;
}
