/**
 * The rig upkeep reminders by e-mail, a scheduled job (daily, RIG_REMINDER_CRON). For every rig of
 * every shop the reminders of the day (./reminders.ts) are worked out; those that came up since
 * the last run are mailed to the rig's keeper, or to the leads when nobody keeps it, in one message
 * per rig. A reminder is mailed once while it stands (rig_reminder_notices), and again only if it
 * clears (oil changed, gauge checked) and later comes back. The notices, the mail and its
 * delivery job commit together, so a rerun after a crash mails nothing twice.
 */
import type { Database } from "@/db/client";
import { listRigEventsByRig, listRigItemsByRig, listOrganizationsWithRigItems, listRigReminderNoticesByRig, listRigsWithKeeperByOrganization, updateRigReminderNoticesByRig } from "@/db/queries/rigs";
import { listLeadEmailsByOrganization } from "@/db/queries/review";
import { rigRemindersMail } from "@/lib/notify/messages";
import { queueMail } from "@/lib/notify/outbox";
import { rigReminders } from "./reminders";
import { reminderInputs, todayIso } from "./service";

export interface ReminderRun {
  rigs: number;
  mailed: number;
}

/** Mail every rig reminder that came up by `today` (YYYY-MM-DD, UTC by default), in every shop or one. */
export async function mailRigReminders(db: Database, params: { today?: string; organizationId?: string } = {}): Promise<ReminderRun> {
  const today = params.today ?? todayIso();
  const run: ReminderRun = { rigs: 0, mailed: 0 };
  const shops = params.organizationId ? [params.organizationId] : await listOrganizationsWithRigItems(db);
  for (const organizationId of shops) {
    const leads = await listLeadEmailsByOrganization(db, { organizationId });
    for (const rig of await listRigsWithKeeperByOrganization(db, { organizationId })) {
      run.rigs++;
      const [items, events, notified] = await Promise.all([
        listRigItemsByRig(db, { organizationId, rigId: rig.id }),
        listRigEventsByRig(db, { organizationId, rigId: rig.id, limit: 500 }),
        listRigReminderNoticesByRig(db, { organizationId, rigId: rig.id }),
      ]);
      const inputs = reminderInputs(items, events);
      const standing = rigReminders(inputs.items, inputs.events, today);
      const key = (r: { itemId: string; code: string }) => `${r.itemId} ${r.code}`;
      const fresh = standing.filter((r) => !notified.has(key(r)));
      const standingKeys = new Set(standing.map(key));
      const cleared = [...notified].filter((k) => !standingKeys.has(k)).map((k) => ({ itemId: k.split(" ")[0], code: k.split(" ")[1] }));
      if (!fresh.length && !cleared.length) continue;
      const to = rig.keeperEmail ? [rig.keeperEmail] : leads;
      await db.transaction(async (tx) => {
        await updateRigReminderNoticesByRig(tx, { organizationId, rigId: rig.id, added: fresh.map((r) => ({ itemId: r.itemId, code: r.code })), cleared });
        if (fresh.length && to.length) {
          await queueMail(tx, to.map((address) => ({ ...rigRemindersMail(address, rig, fresh), organizationId })));
          run.mailed++;
        }
      });
    }
  }
  return run;
}
