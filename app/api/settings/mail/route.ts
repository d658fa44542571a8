import { db } from "@/db/client";
import { getShopMailSettings, listMemberIdsAmong, upsertShopMailSettings } from "@/db/queries/mail-settings";
import { route } from "@/lib/api/handler";
import { AppError } from "@/lib/errors";
import { shopMailSettingsSchema } from "@/lib/settings/mail-schemas";

export const dynamic = "force-dynamic";

const answer = (s: { senderName: string | null; reviewMailTo: string[] }) => ({ senderName: s.senderName, reviewMailTo: s.reviewMailTo.length ? s.reviewMailTo : "leads" });

/** GET /api/settings/mail — { senderName, reviewMailTo: "leads" | userId[] } for the owner. */
export const GET = route({ policy: "mailSettings.read" }, async ({ actor }) => answer(await getShopMailSettings(db(), { organizationId: actor.organizationId })));

/** PUT /api/settings/mail — the owner sets the From name of the shop's mail and who receives review mail. */
export const PUT = route({ policy: "mailSettings.manage", body: shopMailSettingsSchema }, async ({ actor, body }) => {
  const wanted = body.reviewMailTo === "leads" ? [] : [...new Set(body.reviewMailTo)];
  const members = await listMemberIdsAmong(db(), { organizationId: actor.organizationId, userIds: wanted });
  const missing = wanted.filter((id) => !members.includes(id));
  if (missing.length) throw new AppError("invalid_input", `reviewMailTo: ${missing.length === 1 ? "one person chosen is" : `${missing.length} people chosen are`} not a member of the shop`, { missing });
  const settings = { senderName: body.senderName, reviewMailTo: wanted };
  await upsertShopMailSettings(db(), { organizationId: actor.organizationId, ...settings });
  return answer(settings);
});
