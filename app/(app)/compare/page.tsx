import type { Metadata } from "next";
import { CompareView } from "@/components/overlay/CompareView";
import { db } from "@/db/client";
import { loadOverlay, type OverlayResult } from "@/lib/casebook/overlay";
import { AppError } from "@/lib/errors";
import { OVERLAY_MAX_TESTS } from "@/lib/casebook/limits";
import { pageActor } from "@/lib/session";

export const metadata: Metadata = { title: "Compare curves" };

/** /compare?tests=id1,id2,… — up to eight curves on one chart, aligned at isolation. */
export default async function ComparePage({ searchParams }: { searchParams: Promise<{ tests?: string | string[] }> }) {
  const actor = await pageActor();
  const raw = (await searchParams).tests;
  const ids = [...new Set((Array.isArray(raw) ? raw.join(",") : raw ?? "").split(",").map((s) => s.trim()).filter((s) => /^[0-9a-f-]{36}$/i.test(s)))].slice(0, OVERLAY_MAX_TESTS);
  // The curves come with the page (one round trip fewer than fetching them after it loads); none
  // visible is left to the view, which says so.
  let initial: OverlayResult | null = null;
  if (ids.length > 0) {
    try {
      initial = await loadOverlay(db(), actor, ids);
    } catch (e) {
      if (!(e instanceof AppError && e.code === "not_found")) throw e;
    }
  }
  return (
    <div className="mx-auto w-full max-w-5xl space-y-5 px-4 py-5 sm:py-8">
      <header className="space-y-1">
        <h1 className="text-headline">Compare curves</h1>
        <p className="text-body text-fg-soft">Up to {OVERLAY_MAX_TESTS} tests, time zero at each one’s isolation. Share this page’s address with anyone in your shop.</p>
      </header>
      <CompareView ids={ids} initial={initial} />
    </div>
  );
}
