import type { Metadata } from "next";
import Link from "next/link";
import { db } from "@/db/client";
import { listRigsByViewer } from "@/db/queries/rigs";
import { Card } from "@/components/ui";
import { canManageOwnRigs } from "@/lib/rigs/access";
import { viewerOf } from "@/lib/rigs/service";
import { pageActor } from "@/lib/session";
import { NewRigForm } from "./NewRigForm";

export const metadata: Metadata = { title: "Rigs" };

/** Rigs the member may see (owners and leads: all), and a form to add one. */
export default async function RigsPage() {
  const actor = await pageActor();
  const rigs = await listRigsByViewer(db(), { viewer: viewerOf(actor) });
  return (
    <div className="mx-auto w-full max-w-3xl space-y-4 px-4 py-5 sm:py-8">
      <div>
        <h1 className="text-headline">Rigs and pumps</h1>
        <p className="text-body text-fg-soft">Each rig is one kit: pump, micron gauge, hoses and core tools, with its upkeep.</p>
      </div>
      <Card title="Rigs" flush>
        {rigs.length === 0 ? (
          <p className="px-4 pb-4 text-body text-fg-soft">No rigs yet.</p>
        ) : (
          <ul className="divide-y divide-surface-line">
            {rigs.map((r) => (
              <li key={r.id}>
                <Link href={`/tools/rigs/${r.id}`} className="flex min-h-tap flex-col px-4 py-3 hover:bg-surface-sunken">
                  <span className="font-medium">{r.name}</span>
                  <span className="text-caption text-fg-soft">{[r.truck, r.keeperName && `kept by ${r.keeperName}`].filter(Boolean).join(" · ")}</span>
                </Link>
              </li>
            ))}
          </ul>
        )}
      </Card>
      {canManageOwnRigs(actor.role) && <NewRigForm />}
    </div>
  );
}
