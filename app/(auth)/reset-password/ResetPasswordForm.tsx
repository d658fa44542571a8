"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { Alert, Button, Input } from "@/components/ui";
import { authClient, authErrorMessage } from "@/lib/auth-client";

const MIN_PASSWORD = 10;

export function ResetPasswordForm({ token }: { token: string }) {
  const router = useRouter();
  const [password, setPassword] = useState("");
  const [again, setAgain] = useState("");
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [fieldError, setFieldError] = useState<{ password?: string; again?: string }>({});

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    setError(null);
    if (password.length < MIN_PASSWORD) return setFieldError({ password: `Use at least ${MIN_PASSWORD} characters.` });
    if (password !== again) return setFieldError({ again: "The two passwords are not the same." });
    setFieldError({});
    setBusy(true);
    const { error: err } = await authClient.resetPassword({ newPassword: password, token });
    if (err) {
      setError(authErrorMessage(err));
      setBusy(false);
      return;
    }
    router.replace("/sign-in?reset=1");
  }

  return (
    <form onSubmit={submit} className="flex flex-col gap-4" noValidate>
      {error && <Alert tone="error">{error}</Alert>}
      <Input label="New password" type="password" autoComplete="new-password" value={password} onChange={(e) => setPassword(e.target.value)} error={fieldError.password} hint={`At least ${MIN_PASSWORD} characters.`} />
      <Input label="New password again" type="password" autoComplete="new-password" value={again} onChange={(e) => setAgain(e.target.value)} error={fieldError.again} />
      <Button type="submit" size="lg" block busy={busy}>
        Save the new password
      </Button>
    </form>
  );
}
