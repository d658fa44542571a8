"use client";

import { useState } from "react";
import { Alert, Button, Input } from "@/components/ui";
import { authClient, authErrorMessage } from "@/lib/auth-client";

export function ForgotPasswordForm({ email: initial }: { email?: string }) {
  const [email, setEmail] = useState(initial ?? "");
  const [busy, setBusy] = useState(false);
  const [sentTo, setSentTo] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    setError(null);
    if (!/^\S+@\S+\.\S+$/.test(email.trim())) {
      setError("That does not look like an e-mail address.");
      return;
    }
    setBusy(true);
    const { error: err } = await authClient.requestPasswordReset({ email: email.trim(), redirectTo: "/reset-password" });
    setBusy(false);
    if (err) setError(authErrorMessage(err));
    else setSentTo(email.trim());
  }

  if (sentTo) {
    return (
      <Alert tone="success" title="Check your e-mail">
        If {sentTo} has a Riseline account, a link to choose a new password is on its way. It works for one hour.
      </Alert>
    );
  }
  return (
    <form onSubmit={submit} className="flex flex-col gap-4" noValidate>
      {error && <Alert tone="error">{error}</Alert>}
      <Input label="E-mail" type="email" autoComplete="email" inputMode="email" value={email} onChange={(e) => setEmail(e.target.value)} />
      <Button type="submit" size="lg" block busy={busy}>
        Send the reset link
      </Button>
    </form>
  );
}
