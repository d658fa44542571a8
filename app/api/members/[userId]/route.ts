import { z } from "zod";
import { getAuth } from "@/lib/auth";
import { route, type Actor } from "@/lib/api/handler";
import { AppError } from "@/lib/errors";
import { ROLES } from "@/lib/permissions";
import { viaAuth } from "../auth-errors";

const params = z.object({ userId: z.string().min(1).max(200) });

/** better-auth's member row for a user in the caller's shop; 404 when not in this shop. */
async function memberInShop(req: Request, actor: Actor, userId: string) {
  const { members } = await viaAuth(() =>
    getAuth().api.listMembers({ headers: req.headers, query: { organizationId: actor.organizationId, limit: 1000 } }),
  );
  const found = members.find((m) => m.userId === userId);
  if (!found) throw new AppError("not_found", "No member with that id in this shop.");
  return found;
}

function notSelf(actor: Actor, userId: string, what: string) {
  if (actor.userId === userId) throw new AppError("invalid_input", `You cannot ${what} yourself here; another owner can.`);
}

/** PATCH /api/members/:userId {role} — changes a member's role. */
export const PATCH = route(
  { policy: "member.manage", params, body: z.object({ role: z.enum(ROLES) }) },
  async ({ req, actor, params: p, body }) => {
    const found = await memberInShop(req, actor, p.userId);
    notSelf(actor, p.userId, "change the role of");
    const updated = await viaAuth(() =>
      getAuth().api.updateMemberRole({ headers: req.headers, body: { memberId: found.id, role: body.role, organizationId: actor.organizationId } }),
    );
    return { member: { userId: p.userId, role: updated?.role ?? body.role } };
  },
);

/** DELETE /api/members/:userId — removes a member from the shop (their tests stay with the shop). */
export const DELETE = route({ policy: "member.manage", params }, async ({ req, actor, params: p }) => {
  const found = await memberInShop(req, actor, p.userId);
  notSelf(actor, p.userId, "remove");
  await viaAuth(() => getAuth().api.removeMember({ headers: req.headers, body: { memberIdOrEmail: found.id, organizationId: actor.organizationId } }));
  return { removed: p.userId };
});
