"use client";

import { useEffect, useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { apiFetch } from "@/lib/client/api";

export interface SimilarNameMatch {
  id: string;
  name: string;
  detail: string | null;
  score: number;
}

/**
 * A warning under a name about to be created: the shop's records named like it (pg_trgm, GET
 * /api/records/similar), each with a button to use that one instead. Asks 350 ms after the last
 * keystroke; says nothing while the name is short or nothing is alike.
 */
export function SimilarNames({ kind, name, siteId, onUse }: { kind: "customer" | "site" | "system"; name: string; siteId?: string | null; onUse?: (m: SimilarNameMatch) => void }) {
  const [asked, setAsked] = useState(name.trim());
  useEffect(() => {
    const t = setTimeout(() => setAsked(name.trim()), 350);
    return () => clearTimeout(t);
  }, [name]);
  const qs = new URLSearchParams({ kind, name: asked, ...(siteId ? { siteId } : {}) }).toString();
  const q = useQuery({
    queryKey: ["similar-names", qs],
    queryFn: ({ signal }) => apiFetch<{ matches: SimilarNameMatch[] }>(`/api/records/similar?${qs}`, {}, { signal }),
    enabled: asked.length >= 3,
    staleTime: 30_000,
    retry: false,
  });
  const matches = q.data?.matches ?? [];
  if (asked.length < 3 || matches.length === 0) return null;
  const noun = kind === "customer" ? "customer" : kind === "site" ? "site" : "system";
  return (
    <div role="status" className="mt-2 rounded-lg border-2 border-flare-500 bg-flare-100 px-3 py-2 text-ink dark:bg-surface-raised dark:text-fg" data-testid={`similar-${kind}`}>
      <p className="text-body font-semibold">Already in your records — is it one of these?</p>
      <ul className="mt-1 space-y-1">
        {matches.map((m) => (
          <li key={m.id} className="flex flex-wrap items-center justify-between gap-2 text-body">
            <span>
              {m.name}
              {m.detail ? <span className="text-caption text-fg-soft"> · {m.detail}</span> : null}
            </span>
            {onUse && (
              <button type="button" className="min-h-tap rounded-lg px-2 text-body font-medium text-tide-700 underline dark:text-tide-300" onClick={() => onUse(m)}>
                Use this {noun}
              </button>
            )}
          </li>
        ))}
      </ul>
      <p className="mt-1 text-caption">If it is a different one, carry on: a new {noun} is created.</p>
    </div>
  );
}
