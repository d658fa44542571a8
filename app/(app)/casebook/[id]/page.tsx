import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { db } from "@/db/client";
import { listTestsByOrganization } from "@/db/queries/vacuum-tests";
import { Badge } from "@/components/ui";
import { loadCollection } from "@/lib/casebook/service";
import { AppError } from "@/lib/errors";
import { can } from "@/lib/permissions";
import { pageActor } from "@/lib/session";
import { CollectionView } from "./CollectionView";

export const metadata: Metadata = { title: "Casebook collection" };
export const dynamic = "force-dynamic";

export default async function CollectionPage({ params }: { params: Promise<{ id: string }> }) {
  const actor = await pageActor("casebook.read");
  const { id } = await params;
  if (!/^[0-9a-f-]{36}$/i.test(id)) notFound();
  let detail;
  try {
    detail = await loadCollection(db(), actor, id);
  } catch (err) {
    if (err instanceof AppError && err.code === "not_found") notFound();
    throw err;
  }
  const curate = can(actor.role, "casebook.curate");
  const recent = curate
    ? (await listTestsByOrganization(db(), { viewer: actor, filters: { limit: 60 } })).map((t) => ({ id: t.id, title: t.title, verdict: t.verdict, meetsProfile: t.meetsProfile, siteName: t.siteName, technicianName: t.technicianName, testedAt: t.testedAt.toISOString() }))
    : [];
  const c = detail.collection;
  return (
    <div className="mx-auto w-full max-w-5xl space-y-5 px-4 py-5 sm:py-8">
      <header className="space-y-1">
        <p className="text-body text-fg-soft">Casebook</p>
        <h1 className="flex flex-wrap items-center gap-2 text-headline break-words">
          {c.title} {c.isSimulated && <Badge tone="attention">Simulated</Badge>}
        </h1>
        {c.description && <p className="text-body">{c.description}</p>}
      </header>
      <CollectionView collectionId={c.id} entries={detail.entries} curate={curate} recentTests={recent} />
    </div>
  );
}
