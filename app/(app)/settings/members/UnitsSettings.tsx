"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { Alert, Button, Card, Select } from "@/components/ui";
import { apiFetch } from "@/lib/client/api";
import type { UnitSystem } from "@/lib/units/convert";
import type { UnitSettings } from "@/lib/units/settings";

const WORDS: Record<UnitSystem, string> = { imperial: "Imperial: °F, ft, lb·oz, psig", metric: "Metric: °C, m, kg, kPa" };

/**
 * The shop's units (the owner chooses) and the person's own (anyone, over the shop's). Microns
 * stay microns in both. Saving refreshes the page so every screen picks the new units up.
 */
export function UnitsSettings({ initial, canManage }: { initial: UnitSettings; canManage: boolean }) {
  const router = useRouter();
  const [saved, setSaved] = useState(initial);
  const [shop, setShop] = useState<UnitSystem>(initial.shop);
  const [mine, setMine] = useState<UnitSystem | "">(initial.person ?? "");
  const [busy, setBusy] = useState<"shop" | "mine" | null>(null);
  const [error, setError] = useState<string | null>(null);
  const save = async (which: "shop" | "mine") => {
    setBusy(which);
    setError(null);
    try {
      const body = which === "shop" ? { unitSystem: shop } : { unitSystem: mine === "" ? null : mine };
      const r = await apiFetch<UnitSettings>(which === "shop" ? "/api/settings/units" : "/api/settings/units/mine", {
        method: "PUT",
        body: JSON.stringify(body),
      });
      setSaved(r);
      router.refresh();
    } catch (err) {
      setError((err as Error).message);
    } finally {
      setBusy(null);
    }
  };
  return (
    <Card title="Units" data-testid="units-settings">
      <p className="text-body text-fg-soft">
        The shop works in {WORDS[saved.shop]}. You see {WORDS[saved.effective]}
        {saved.person ? " (your own choice)" : ""}. Vacuum is always in microns.
      </p>
      {canManage ? (
        <form className="mt-3 flex flex-wrap items-end gap-2" onSubmit={(e) => (e.preventDefault(), void save("shop"))}>
          <Select label="Shop units" value={shop} onChange={(e) => setShop(e.target.value as UnitSystem)} className="min-w-64">
            <option value="imperial">{WORDS.imperial}</option>
            <option value="metric">{WORDS.metric}</option>
          </Select>
          <Button type="submit" busy={busy === "shop"} disabled={shop === saved.shop}>
            Save shop units
          </Button>
        </form>
      ) : null}
      <form className="mt-3 flex flex-wrap items-end gap-2" onSubmit={(e) => (e.preventDefault(), void save("mine"))}>
        <Select label="Your units" value={mine} onChange={(e) => setMine(e.target.value as UnitSystem | "")} className="min-w-64">
          <option value="">Same as the shop</option>
          <option value="imperial">{WORDS.imperial}</option>
          <option value="metric">{WORDS.metric}</option>
        </Select>
        <Button type="submit" busy={busy === "mine"} disabled={mine === (saved.person ?? "")}>
          Save your units
        </Button>
      </form>
      {error && <Alert tone="error">{error}</Alert>}
    </Card>
  );
}
