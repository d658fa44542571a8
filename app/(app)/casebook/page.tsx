import type { Metadata } from "next";
import Link from "next/link";
import { db } from "@/db/client";
import { Badge, Card, EmptyState } from "@/components/ui";
import { listCollections } from "@/lib/casebook/service";
import { can } from "@/lib/permissions";
import { pageActor } from "@/lib/session";
import { NewCollectionForm } from "./NewCollectionForm";

export const metadata: Metadata = { title: "Casebook" };
export const dynamic = "force-dynamic";

/** The casebook: the trainer's collections of curves worth learning from. */
export default async function CasebookPage() {
  const actor = await pageActor("casebook.read");
  const collections = await listCollections(db(), actor);
  const curate = can(actor.role, "casebook.curate");
  return (
    <div className="mx-auto w-full max-w-5xl space-y-5 px-4 py-5 sm:py-8">
      <header className="flex flex-wrap items-end justify-between gap-3">
        <div className="space-y-1">
          <h1 className="text-headline">Casebook</h1>
          <p className="text-body text-fg-soft">Curves worth learning from, with the trainer’s notes pinned where it matters.</p>
        </div>
        <Link href="/practice" className="text-body font-medium text-tide-700 underline-offset-2 hover:underline dark:text-tide-200">Practice calls →</Link>
      </header>
      {curate && <NewCollectionForm />}
      {collections.length === 0 ? (
        <EmptyState title="No collections yet">{curate ? "Start one above, then add tests to it." : "Your trainer has not built any collections yet."}</EmptyState>
      ) : (
        <ul className="grid gap-4 sm:grid-cols-2" aria-label="Collections">
          {collections.map((c) => (
            <li key={c.id}>
              <Card className="h-full">
                <Link href={`/casebook/${c.id}`} className="block space-y-2">
                  <span className="flex flex-wrap items-center gap-2">
                    <span className="text-title font-semibold text-fg underline-offset-2 hover:underline">{c.title}</span>
                    {c.isSimulated && <Badge tone="attention">Simulated</Badge>}
                  </span>
                  {c.description && <span className="block text-body text-fg-soft">{c.description}</span>}
                  <span className="block text-caption text-fg-soft">
                    {c.entryCount} curve{c.entryCount === 1 ? "" : "s"} · by {c.createdByName}
                  </span>
                </Link>
              </Card>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
