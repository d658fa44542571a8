import type { Metadata } from "next";
import { codeWords } from "@/lib/words/codes";
import Link from "next/link";
import { notFound } from "next/navigation";
import { db } from "@/db/client";
import { getSiteById, listSitesByOrganization, listSystemsByOrganization } from "@/db/queries/records";
import { MergeSite } from "./MergeSite";
import { Card, LinkButton } from "@/components/ui";
import { can } from "@/lib/permissions";
import { pageActor } from "@/lib/session";
import { NewSystemForm } from "../../RecordForms";

export const metadata: Metadata = { title: "Site" };
export const dynamic = "force-dynamic";
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export default async function SitePage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const actor = await pageActor();
  if (!UUID.test(id)) notFound();
  const site = await getSiteById(db(), { organizationId: actor.organizationId, siteId: id });
  if (!site) notFound();
  const systems = await listSystemsByOrganization(db(), { organizationId: actor.organizationId, siteId: id });
  return (
    <div className="mx-auto w-full max-w-3xl space-y-5 px-4 py-5 sm:py-8">
      <LinkButton href="/records" variant="quiet">← Customers</LinkButton>
      <div>
        <h1 className="text-headline">{site.name}</h1>
        <p className="text-body text-fg-soft">{[site.address, site.customerName].filter(Boolean).join(" · ") || "No address on file"}</p>
      </div>
      <Card title="Systems">
        {systems.length === 0 ? (
          <p className="text-body text-fg-soft">No systems at this site yet.</p>
        ) : (
          <ul className="divide-y divide-surface-line">
            {systems.map((s) => (
              <li key={s.id} className="py-2">
                <Link href={`/records/systems/${s.id}`} className="font-medium text-tide-700 underline dark:text-tide-200">{s.name}</Link>
                <p className="text-caption text-fg-soft">{[codeWords(s.kind), s.refrigerant, s.installedOn ? `installed ${s.installedOn}` : null].filter(Boolean).join(" · ")}</p>
              </li>
            ))}
          </ul>
        )}
      </Card>
      {can(actor.role, "records.manage") && <NewSystemForm siteId={id} />}
      {can(actor.role, "records.manage") && (
        <MergeSite
          siteId={id}
          siteName={site.name}
          others={(await listSitesByOrganization(db(), { organizationId: actor.organizationId }))
            .filter((s) => s.id !== id)
            .map((s) => ({ id: s.id, name: s.name, detail: [s.customerName, s.address].filter(Boolean).join(" · ") || null }))}
        />
      )}
    </div>
  );
}
