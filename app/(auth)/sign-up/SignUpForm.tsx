"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { Alert, Button, Input } from "@/components/ui";
import { authClient, authErrorMessage } from "@/lib/auth-client";

const MIN_PASSWORD = 10;

/** "Cold Snap Heating" → "cold-snap-heating-4f2a9c": readable, and unique thanks to the suffix. */
function shopSlug(name: string): string {
  const base = name.toLowerCase().normalize("NFKD").replace(/[^a-z0-9]+/g, "-").replace(/^-+|-+$/g, "").slice(0, 40) || "shop";
  const suffix = crypto.getRandomValues(new Uint32Array(1))[0].toString(36).slice(0, 6);
  return `${base}-${suffix}`;
}

export function SignUpForm() {
  const router = useRouter();
  // The shop's time zone is proposed from this device; reports write times in it (changeable under Shop).
  const [form, setForm] = useState(() => ({ name: "", email: "", password: "", shop: "", timeZone: (typeof Intl !== "undefined" && Intl.DateTimeFormat().resolvedOptions().timeZone) || "UTC" }));
  const [fieldErrors, setFieldErrors] = useState<Partial<Record<keyof typeof form, string>>>({});
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const set = (k: keyof typeof form) => (e: React.ChangeEvent<HTMLInputElement>) => setForm({ ...form, [k]: e.target.value });

  function check(): boolean {
    const errs: typeof fieldErrors = {};
    if (!form.name.trim()) errs.name = "Write your name as your crew knows it.";
    if (!/^\S+@\S+\.\S+$/.test(form.email.trim())) errs.email = "That does not look like an e-mail address.";
    if (form.password.length < MIN_PASSWORD) errs.password = `Use at least ${MIN_PASSWORD} characters.`;
    if (!form.shop.trim()) errs.shop = "Name the shop (you can change it later).";
    setFieldErrors(errs);
    return Object.keys(errs).length === 0;
  }

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    setError(null);
    if (!check()) return;
    setBusy(true);
    const up = await authClient.signUp.email({ name: form.name.trim(), email: form.email.trim(), password: form.password });
    if (up.error) {
      if (up.error.code?.startsWith("USER_ALREADY_EXISTS")) setFieldErrors({ email: authErrorMessage(up.error) });
      else if (up.error.code?.startsWith("PASSWORD_")) setFieldErrors({ password: authErrorMessage(up.error) });
      else setError(authErrorMessage(up.error));
      setBusy(false);
      return;
    }
    const org = await authClient.organization.create({ name: form.shop.trim(), slug: shopSlug(form.shop) });
    if (org.error || !org.data) {
      // The account exists now; the no-shop page lets them try the shop again.
      setError(`Your account is ready, but the shop was not created: ${authErrorMessage(org.error)}`);
      setBusy(false);
      router.replace("/no-shop");
      return;
    }
    await authClient.organization.setActive({ organizationId: org.data.id });
    if (form.timeZone.trim()) {
      // A zone the server does not know leaves the shop at UTC; the owner can set it under Shop.
      await fetch("/api/settings/shop", { method: "PUT", headers: { "content-type": "application/json" }, body: JSON.stringify({ timeZone: form.timeZone.trim() }) }).catch(() => null);
    }
    router.replace("/home");
    router.refresh();
  }

  return (
    <form onSubmit={submit} className="flex flex-col gap-4" noValidate>
      {error && <Alert tone="error">{error}</Alert>}
      <Input label="Your name" autoComplete="name" value={form.name} onChange={set("name")} error={fieldErrors.name} />
      <Input label="E-mail" type="email" autoComplete="email" inputMode="email" value={form.email} onChange={set("email")} error={fieldErrors.email} />
      <Input
        label="Password"
        type="password"
        autoComplete="new-password"
        value={form.password}
        onChange={set("password")}
        error={fieldErrors.password}
        hint={`At least ${MIN_PASSWORD} characters. A short sentence works well.`}
      />
      <Input label="Shop name" autoComplete="organization" value={form.shop} onChange={set("shop")} error={fieldErrors.shop} hint="The company or crew the test records belong to." />
      <Input label="Shop time zone" autoComplete="off" value={form.timeZone} onChange={set("timeZone")} hint="Reports write times in it. Proposed from this device." />
      <Button type="submit" size="lg" block busy={busy}>
        Create account and shop
      </Button>
    </form>
  );
}
