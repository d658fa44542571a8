import type { Metadata } from "next";
import Link from "next/link";
import { db } from "@/db/client";
import { listMembersByOrganization } from "@/db/queries/members";
import { listCustomersByOrganization, listJobsByOrganization, listSitesByOrganization } from "@/db/queries/records";
import { Card, EmptyState } from "@/components/ui";
import { can, canSeeCustomerContact } from "@/lib/permissions";
import { pageActor } from "@/lib/session";
import { NewCustomerForm, NewJobForm, NewSiteForm } from "./RecordForms";

export const metadata: Metadata = { title: "Customers" };
export const dynamic = "force-dynamic";

/** Customers, their sites and the jobs (visits) of the shop. */
export default async function RecordsPage() {
  const actor = await pageActor();
  const org = actor.organizationId;
  const [customers, sites, jobs, members] = await Promise.all([
    listCustomersByOrganization(db(), { organizationId: org, withContact: canSeeCustomerContact(actor.role) }),
    listSitesByOrganization(db(), { organizationId: org }),
    listJobsByOrganization(db(), { organizationId: org }),
    listMembersByOrganization(db(), { organizationId: org }),
  ]);
  const manage = can(actor.role, "records.manage");
  const siteName = new Map(sites.map((s) => [s.id, s.name]));
  const memberName = new Map(members.map((m) => [m.userId, m.name]));
  return (
    <div className="mx-auto w-full max-w-3xl space-y-5 px-4 py-5 sm:py-8">
      <h1 className="text-headline">Customers</h1>
      <p className="text-body text-fg-soft">Customers, their sites and systems, and the visits (jobs) to them.</p>
      <Card title="Sites">
        {sites.length === 0 ? (
          <EmptyState title="No sites yet">Add a site, or name one when you upload a test.</EmptyState>
        ) : (
          <ul className="divide-y divide-surface-line">
            {sites.map((s) => (
              <li key={s.id} className="py-2">
                <Link href={`/records/sites/${s.id}`} className="font-medium text-tide-700 underline dark:text-tide-200">{s.name}</Link>
                <p className="text-caption text-fg-soft">{[s.address, s.customerName].filter(Boolean).join(" · ") || "No address"}</p>
              </li>
            ))}
          </ul>
        )}
      </Card>
      <Card title="Customers">
        {customers.length === 0 ? (
          <p className="text-body text-fg-soft">No customers yet.</p>
        ) : (
          <ul className="divide-y divide-surface-line">
            {customers.map((c) => (
              <li key={c.id} className="py-2">
                <p className="font-medium">{c.name}</p>
                <p className="text-caption text-fg-soft">{canSeeCustomerContact(actor.role) ? [c.email, c.phone].filter(Boolean).join(" · ") || "No contact details" : "Contact details: ask a technician or lead"}</p>
              </li>
            ))}
          </ul>
        )}
      </Card>
      <Card title="Jobs">
        {jobs.length === 0 ? (
          <p className="text-body text-fg-soft">No jobs yet.</p>
        ) : (
          <ul className="divide-y divide-surface-line">
            {jobs.slice(0, 50).map((j) => (
              <li key={j.id} className="py-2">
                <p className="font-medium">{j.visitedOn}{j.reference ? ` · ${j.reference}` : ""}</p>
                <p className="text-caption text-fg-soft">
                  {[j.siteId ? siteName.get(j.siteId) : null, j.technicianId ? memberName.get(j.technicianId) : null, j.reason].filter(Boolean).join(" · ")}
                </p>
              </li>
            ))}
          </ul>
        )}
      </Card>
      {manage && (
        <div className="space-y-4">
          <NewSiteForm customers={customers} />
          <NewCustomerForm />
          <NewJobForm sites={sites} technicians={members.map((m) => ({ id: m.userId, name: m.name }))} />
        </div>
      )}
    </div>
  );
}
