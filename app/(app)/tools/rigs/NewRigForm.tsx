"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { Alert, Button, Card, Input } from "@/components/ui";
import { apiFetch, ApiError } from "@/lib/client/api";

export function NewRigForm() {
  const router = useRouter();
  const [name, setName] = useState("");
  const [truck, setTruck] = useState("");
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  async function create() {
    setBusy(true);
    setError(null);
    try {
      const { rig } = await apiFetch<{ rig: { id: string } }>("/api/rigs", { method: "POST", body: JSON.stringify({ name, truck }) });
      router.push(`/tools/rigs/${rig.id}`);
    } catch (e) {
      setError(e instanceof ApiError ? e.message : String(e));
      setBusy(false);
    }
  }
  return (
    <Card title="Add a rig">
      <div className="grid gap-3 sm:grid-cols-2">
        <Input label="Rig name" value={name} onChange={(e) => setName(e.target.value)} />
        <Input label="Truck (optional)" value={truck} onChange={(e) => setTruck(e.target.value)} />
      </div>
      {error && <Alert tone="error" className="mt-3">{error}</Alert>}
      <Button className="mt-3" block busy={busy} disabled={!name.trim()} onClick={create}>
        Add rig
      </Button>
    </Card>
  );
}
