"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { Alert, Button, Input } from "@/components/ui";
import { authClient, authErrorMessage, type AuthClientError } from "@/lib/auth-client";
import { ApiError, apiFetch } from "@/lib/client/api";

const MIN_PASSWORD = 10;

interface Props {
  invitationId: string;
  /** The key from the e-mailed link (it proves the address is the reader's); null when the link lost it. */
  invitationKey: string | null;
  invitedEmail: string;
  shopName: string;
  /** E-mail of the person signed in in this browser, if anyone. */
  signedInEmail: string | null;
}

/**
 * Signed in as the invited e-mail: one button. Signed in as someone else: sign out first.
 * Signed out: create the account for the invited e-mail, or sign in to an existing one; then accept.
 */
export function InviteActions({ invitationId, invitationKey, invitedEmail, shopName, signedInEmail }: Props) {
  const router = useRouter();
  const [mode, setMode] = useState<"create" | "sign-in">("create");
  const [name, setName] = useState("");
  const [password, setPassword] = useState("");
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [fieldError, setFieldError] = useState<{ name?: string; password?: string }>({});
  const sameUser = signedInEmail?.toLowerCase() === invitedEmail.toLowerCase();

  function fail(err: AuthClientError | null | undefined) {
    setError(authErrorMessage(err));
    setBusy(false);
  }

  async function accept() {
    try {
      await apiFetch(`/api/invitations/${encodeURIComponent(invitationId)}/accept`, { method: "POST", body: JSON.stringify({ key: invitationKey }) });
    } catch (err) {
      return fail(err instanceof ApiError ? { status: err.status, code: err.code, message: err.message } : null);
    }
    router.replace("/home");
    router.refresh();
  }

  if (!invitationKey) {
    return (
      <Alert tone="warning" title="Open the link from the e-mail">
        This address is missing the key from the invitation e-mail. Open the link in the e-mail sent to {invitedEmail} itself: it proves the address is yours.
      </Alert>
    );
  }

  if (signedInEmail && !sameUser) {
    return (
      <div className="flex flex-col gap-4">
        <Alert tone="warning" title="Signed in as someone else">
          This browser is signed in as {signedInEmail}, but the invitation is for {invitedEmail}. Sign out, then open the link again.
        </Alert>
        <Button
          variant="secondary"
          block
          busy={busy}
          onClick={async () => {
            setBusy(true);
            await authClient.signOut();
            router.refresh();
            setBusy(false);
          }}
        >
          Sign out of {signedInEmail}
        </Button>
      </div>
    );
  }

  if (sameUser) {
    return (
      <div className="flex flex-col gap-4">
        {error && <Alert tone="error">{error}</Alert>}
        <Button size="lg" block busy={busy} onClick={() => { setBusy(true); setError(null); void accept(); }}>
          Join {shopName}
        </Button>
      </div>
    );
  }

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    setError(null);
    const errs: typeof fieldError = {};
    if (mode === "create" && !name.trim()) errs.name = "Write your name as your crew knows it.";
    if (mode === "create" && password.length < MIN_PASSWORD) errs.password = `Use at least ${MIN_PASSWORD} characters.`;
    if (mode === "sign-in" && !password) errs.password = "Enter your password.";
    setFieldError(errs);
    if (Object.keys(errs).length) return;
    setBusy(true);
    const res =
      mode === "create"
        ? await authClient.signUp.email({ email: invitedEmail, password, name: name.trim() })
        : await authClient.signIn.email({ email: invitedEmail, password });
    if (res.error) {
      if (res.error.code?.startsWith("USER_ALREADY_EXISTS")) {
        setMode("sign-in");
        setError("There is already an account for this e-mail. Sign in with its password to join.");
        setBusy(false);
        return;
      }
      return fail(res.error);
    }
    await accept();
  }

  return (
    <form onSubmit={submit} className="flex flex-col gap-4" noValidate>
      <div role="tablist" aria-label="How to join" className="grid grid-cols-2 gap-1 rounded-xl bg-surface-sunken p-1">
        {(["create", "sign-in"] as const).map((m) => (
          <button
            key={m}
            type="button"
            role="tab"
            aria-selected={mode === m}
            onClick={() => { setMode(m); setError(null); setFieldError({}); }}
            className={"min-h-tap rounded-lg px-2 text-body font-medium " + (mode === m ? "bg-surface-raised text-fg shadow-card" : "text-fg-soft")}
          >
            {m === "create" ? "New here" : "Have an account"}
          </button>
        ))}
      </div>
      {error && <Alert tone="error">{error}</Alert>}
      <Input label="E-mail" type="email" value={invitedEmail} readOnly hint="The invitation is for this address." />
      {mode === "create" && <Input label="Your name" autoComplete="name" value={name} onChange={(e) => setName(e.target.value)} error={fieldError.name} />}
      <Input
        label={mode === "create" ? "Choose a password" : "Password"}
        type="password"
        autoComplete={mode === "create" ? "new-password" : "current-password"}
        value={password}
        onChange={(e) => setPassword(e.target.value)}
        error={fieldError.password}
        hint={mode === "create" ? `At least ${MIN_PASSWORD} characters.` : undefined}
      />
      <Button type="submit" size="lg" block busy={busy}>
        {mode === "create" ? `Create account and join` : `Sign in and join`}
      </Button>
    </form>
  );
}
