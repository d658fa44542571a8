"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { Alert, Badge, Button, Card, EmptyState, Input, Select } from "@/components/ui";
import { INVITABLE_ROLES, ROLES, ROLE_LABELS, isRole } from "@/lib/permissions";
import type { ErrorBody } from "@/lib/errors";

export interface MemberRow { userId: string; name: string; email: string; role: string; joinedAt: string }
export interface InvitationRow { id: string; email: string; role: string; expiresAt: string }

const roleLabel = (r: string) => (isRole(r) ? ROLE_LABELS[r] : r);
const dateFmt = new Intl.DateTimeFormat(undefined, { day: "numeric", month: "short" });

/** What each role may do, in one line, so the owner picks with open eyes. */
const ROLE_SUMMARY: Record<string, string> = {
  owner: "Everything, including the crew and billing.",
  lead: "Sees every test, signs tests off, shares reports, sets acceptance profiles.",
  technician: "Runs and uploads tests, keeps customers and sites.",
  trainer: "Sees every test and curates the casebook.",
  apprentice: "Runs and uploads tests; sees own and shared ones.",
};

async function send(url: string, method: string, body?: unknown): Promise<string | null> {
  const res = await fetch(url, {
    method,
    headers: body ? { "content-type": "application/json" } : undefined,
    body: body ? JSON.stringify(body) : undefined,
  });
  if (res.ok) return null;
  const data = (await res.json().catch(() => null)) as ErrorBody | null;
  return data?.error.message ?? "That did not work. Please try again.";
}

export function MembersManager({ members, invitations, canManage, selfUserId }: { members: MemberRow[]; invitations: InvitationRow[]; canManage: boolean; selfUserId: string }) {
  const router = useRouter();
  const [notice, setNotice] = useState<{ tone: "success" | "error"; text: string } | null>(null);
  const [busy, setBusy] = useState<string | null>(null);

  async function act(key: string, url: string, method: string, body: unknown, ok: string) {
    setBusy(key);
    setNotice(null);
    const err = await send(url, method, body);
    setBusy(null);
    setNotice(err ? { tone: "error", text: err } : { tone: "success", text: ok });
    if (!err) router.refresh();
    return !err;
  }

  return (
    <div className="flex flex-col gap-6">
      {notice && <Alert tone={notice.tone}>{notice.text}</Alert>}
      {canManage && <InviteForm onInvite={(email, role) => act("invite", "/api/members/invitations", "POST", { email, role }, `Invitation sent to ${email}.`)} busy={busy === "invite"} />}

      <Card title={`Crew (${members.length})`} flush>
        <ul data-testid="member-list" className="divide-y divide-surface-line">
          {members.map((m) => (
            <li key={m.userId} className="flex flex-col gap-3 px-4 py-3 sm:flex-row sm:items-center sm:justify-between">
              <div className="min-w-0">
                <p className="truncate font-medium text-fg">
                  {m.name} {m.userId === selfUserId && <span className="text-fg-soft">(you)</span>}
                </p>
                <p className="truncate text-caption text-fg-soft">{m.email}</p>
              </div>
              {canManage && m.userId !== selfUserId ? (
                <div className="flex items-end gap-2">
                  <Select
                    label={<span className="sr-only">Role of {m.name}</span>}
                    className="w-48"
                    value={m.role}
                    disabled={busy === m.userId}
                    onChange={(e) => act(m.userId, `/api/members/${m.userId}`, "PATCH", { role: e.target.value }, `${m.name} is now ${roleLabel(e.target.value)}.`)}
                    options={ROLES.map((r) => ({ value: r, label: ROLE_LABELS[r] }))}
                  />
                  <Button
                    variant="quiet"
                    busy={busy === `rm-${m.userId}`}
                    onClick={() => {
                      if (confirm(`Remove ${m.name} from the shop? Their tests stay with the shop.`)) act(`rm-${m.userId}`, `/api/members/${m.userId}`, "DELETE", undefined, `${m.name} was removed.`);
                    }}
                  >
                    Remove
                  </Button>
                </div>
              ) : (
                <Badge tone={m.role === "owner" ? "brand" : "neutral"} className="self-start sm:self-auto">{roleLabel(m.role)}</Badge>
              )}
            </li>
          ))}
        </ul>
      </Card>

      {canManage && (
        <Card title="Waiting to join">
          {invitations.length === 0 ? (
            <EmptyState title="No open invitations">Invited people appear here until they accept.</EmptyState>
          ) : (
            <ul data-testid="invitation-list" className="-mx-4 divide-y divide-surface-line sm:-mx-5">
              {invitations.map((i) => (
                <li key={i.id} className="flex items-center justify-between gap-3 px-4 py-3 sm:px-5">
                  <div className="min-w-0">
                    <p className="truncate font-medium text-fg">{i.email}</p>
                    <p className="text-caption text-fg-soft">
                      {roleLabel(i.role)} · link works until {dateFmt.format(new Date(i.expiresAt))}
                    </p>
                  </div>
                  <Button variant="quiet" busy={busy === i.id} onClick={() => act(i.id, `/api/members/invitations/${i.id}`, "DELETE", undefined, `Invitation to ${i.email} cancelled.`)}>
                    Cancel
                  </Button>
                </li>
              ))}
            </ul>
          )}
        </Card>
      )}
    </div>
  );
}

function InviteForm({ onInvite, busy }: { onInvite: (email: string, role: string) => Promise<boolean>; busy: boolean }) {
  const [email, setEmail] = useState("");
  const [role, setRole] = useState<string>("technician");
  const [error, setError] = useState<string | null>(null);
  return (
    <Card title="Invite someone">
      <form
        className="flex flex-col gap-4"
        noValidate
        onSubmit={async (e) => {
          e.preventDefault();
          if (!/^\S+@\S+\.\S+$/.test(email.trim())) return setError("That does not look like an e-mail address.");
          setError(null);
          if (await onInvite(email.trim(), role)) setEmail("");
        }}
      >
        <div className="grid gap-4 sm:grid-cols-[1fr_14rem]">
          <Input label="Their e-mail" type="email" inputMode="email" autoComplete="off" value={email} onChange={(e) => setEmail(e.target.value)} error={error} />
          <Select label="Role" value={role} onChange={(e) => setRole(e.target.value)} options={INVITABLE_ROLES.map((r) => ({ value: r, label: ROLE_LABELS[r] }))} hint={ROLE_SUMMARY[role]} />
        </div>
        <Button type="submit" busy={busy} className="self-start">
          Send invitation
        </Button>
      </form>
    </Card>
  );
}
