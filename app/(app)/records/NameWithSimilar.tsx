"use client";

import { useEffect, useRef, useState } from "react";
import { useRouter } from "next/navigation";
import { Input } from "@/components/ui";
import { SimilarNames } from "@/components/records/SimilarNames";

/** A record's name field that warns of similar names before the form creates another (pg_trgm). */
export function NameWithSimilar({ kind, label, siteId, className }: { kind: "customer" | "site" | "system"; label: string; siteId?: string; className?: string }) {
  const [name, setName] = useState("");
  const router = useRouter();
  const box = useRef<HTMLDivElement | null>(null);
  // The form clears itself after creating; the typed name (held here) follows it.
  useEffect(() => {
    const form = box.current?.closest("form");
    const clear = () => setName("");
    form?.addEventListener("reset", clear);
    return () => form?.removeEventListener("reset", clear);
  }, []);
  const open = kind === "site" ? (id: string) => router.push(`/records/sites/${id}`) : kind === "system" ? (id: string) => router.push(`/records/systems/${id}`) : null;
  return (
    <div className={className} ref={box}>
      <Input label={label} name="name" required value={name} onChange={(e) => setName(e.target.value)} />
      <SimilarNames kind={kind} name={name} siteId={siteId} onUse={open ? (m) => open(m.id) : undefined} />
    </div>
  );
}
