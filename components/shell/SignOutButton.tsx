"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { cx } from "@/components/ui/cx";
import { Spinner } from "@/components/ui/Spinner";
import { authClient } from "@/lib/auth-client";
import { Icon } from "./icons";

export function SignOutButton({ className }: { className?: string }) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  return (
    <button
      type="button"
      data-testid="sign-out"
      disabled={busy}
      onClick={async () => {
        // The phone's outbox is this person's: cleared now, with a warning if tests were never sent.
        const { clearPhoneOnSignOut } = await import("@/lib/offline/signout");
        const go = await clearPhoneOnSignOut((n) => window.confirm(`${n} test${n === 1 ? " is" : "s are"} on this phone and not sent yet. Signing out deletes ${n === 1 ? "it" : "them"}. Sign out anyway?`));
        if (!go) return;
        setBusy(true);
        await authClient.signOut();
        router.replace("/sign-in");
        router.refresh();
      }}
      className={cx("inline-flex min-h-tap items-center gap-3 rounded-xl px-3 text-body text-fg hover:bg-surface-sunken", className)}
    >
      {busy ? <Spinner size="sm" label="" /> : <Icon name="signout" />}
      Sign out
    </button>
  );
}
