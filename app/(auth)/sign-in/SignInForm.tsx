"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { Alert, Button, Input } from "@/components/ui";
import { TextLink } from "@/components/shell/AuthFrame";
import { authClient, authErrorMessage, safeNextPath } from "@/lib/auth-client";

export function SignInForm({ next, email: initialEmail, justReset }: { next?: string; email?: string; justReset?: boolean }) {
  const router = useRouter();
  const [email, setEmail] = useState(initialEmail ?? "");
  const [password, setPassword] = useState("");
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    setBusy(true);
    setError(null);
    const { error: err } = await authClient.signIn.email({ email: email.trim(), password });
    if (err) {
      setError(authErrorMessage(err));
      setBusy(false);
      return;
    }
    router.replace(safeNextPath(next));
    router.refresh();
  }

  return (
    <form onSubmit={submit} className="flex flex-col gap-4" noValidate>
      {justReset && <Alert tone="success">Password changed. Sign in with the new one.</Alert>}
      {error && <Alert tone="error">{error}</Alert>}
      <Input label="E-mail" type="email" autoComplete="email" inputMode="email" required value={email} onChange={(e) => setEmail(e.target.value)} />
      <Input label="Password" type="password" autoComplete="current-password" required value={password} onChange={(e) => setPassword(e.target.value)} />
      <Button type="submit" size="lg" block busy={busy}>
        Sign in
      </Button>
      <TextLink href={email ? `/forgot-password?email=${encodeURIComponent(email)}` : "/forgot-password"} className="self-start">
        Forgot password?
      </TextLink>
    </form>
  );
}
