"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { Alert, Button, Input } from "@/components/ui";
import { authClient, authErrorMessage } from "@/lib/auth-client";

function shopSlug(name: string): string {
  const base = name.toLowerCase().normalize("NFKD").replace(/[^a-z0-9]+/g, "-").replace(/^-+|-+$/g, "").slice(0, 40) || "shop";
  return `${base}-${crypto.getRandomValues(new Uint32Array(1))[0].toString(36).slice(0, 6)}`;
}

export function CreateShopForm({ firstShopId, firstShopName, email }: { firstShopId: string | null; firstShopName: string | null; email: string }) {
  const router = useRouter();
  const [shop, setShop] = useState("");
  // Proposed from this device; the owner can change it here or later under Shop.
  const [timeZone, setTimeZone] = useState(() => (typeof Intl !== "undefined" ? Intl.DateTimeFormat().resolvedOptions().timeZone : "UTC") || "UTC");
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);

  async function open(organizationId: string, zone?: string) {
    const res = await authClient.organization.setActive({ organizationId });
    if (res.error) {
      setError(authErrorMessage(res.error));
      setBusy(false);
      return;
    }
    if (zone) {
      const saved = await fetch("/api/settings/shop", { method: "PUT", headers: { "content-type": "application/json" }, body: JSON.stringify({ timeZone: zone }) });
      if (!saved.ok) {
        // The shop exists: a zone the server does not know only leaves it at UTC, changeable under Shop.
        setError("The shop was made, but its time zone could not be saved; set it under Shop.");
      }
    }
    router.replace("/home");
    router.refresh();
  }

  return (
    <div className="flex flex-col gap-5">
      {firstShopId && (
        <Alert tone="info" title={`You are a member of ${firstShopName}`} action={<Button variant="secondary" onClick={() => { setBusy(true); void open(firstShopId); }}>Open {firstShopName}</Button>} />
      )}
      <form
        className="flex flex-col gap-4"
        noValidate
        onSubmit={async (e) => {
          e.preventDefault();
          if (!shop.trim()) return setError("Name the shop.");
          setBusy(true);
          setError(null);
          const res = await authClient.organization.create({ name: shop.trim(), slug: shopSlug(shop) });
          if (res.error || !res.data) {
            setError(authErrorMessage(res.error));
            setBusy(false);
            return;
          }
          await open(res.data.id, timeZone.trim());
        }}
      >
        {error && <Alert tone="error">{error}</Alert>}
        <Input label="Shop name" autoComplete="organization" value={shop} onChange={(e) => setShop(e.target.value)} hint={`You (${email}) become its owner.`} />
        <Input label="Shop time zone" value={timeZone} onChange={(e) => setTimeZone(e.target.value)} hint="Reports write times in it. Proposed from this device." autoComplete="off" />
        <Button type="submit" size="lg" block busy={busy}>
          Start the shop
        </Button>
      </form>
    </div>
  );
}
