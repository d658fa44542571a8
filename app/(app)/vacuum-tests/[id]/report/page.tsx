import type { Metadata } from "next";
import { headers } from "next/headers";
import { notFound, redirect } from "next/navigation";
import { db } from "@/db/client";
import { LinkButton } from "@/components/ui";
import { PrintButton } from "@/components/review/PrintButton";
import { ReportView } from "@/components/review/ReportView";
import { getTestById } from "@/db/queries/vacuum-tests";
import { practiceGate } from "@/lib/practice/gate";
import { buildReportModel } from "@/lib/reports/model";
import { pageActor } from "@/lib/session";

export const metadata: Metadata = { title: "Report" };
export const dynamic = "force-dynamic";

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** The printable report of a test the member can see: the report only (review, comments and sharing live on the test page). */
export default async function ReportPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const actor = await pageActor();
  if (!UUID.test(id)) notFound();
  const visible = await getTestById(db(), { viewer: { organizationId: actor.organizationId, userId: actor.userId, role: actor.role }, testId: id });
  if (!visible) notFound();
  const gate = await practiceGate(db(), { organizationId: actor.organizationId, testId: id, userId: actor.userId, role: actor.role });
  if (gate === "hidden") redirect(`/practice/${id}`);
  const model = await buildReportModel(db(), { organizationId: actor.organizationId, testId: id });
  if (!model) notFound();
  const nonce = (await headers()).get("x-nonce") ?? undefined; // the page's CSP nonce (proxy.ts)
  return (
    <div className="px-4 py-5 sm:py-8 print:p-0">
      {/* Print only the report: the app's navigation and these buttons stay on screen. */}
      <style nonce={nonce}>{"@media print{body *{visibility:hidden}.report,.report *{visibility:visible}.report{position:absolute;inset:0 auto auto 0;width:100%}@page{margin:14mm}}"}</style>
      <div className="mx-auto mb-4 flex max-w-3xl flex-wrap gap-2 print:hidden">
        <LinkButton href={`/vacuum-tests/${id}`} variant="quiet">← Back to the test</LinkButton>
        <PrintButton />
        <LinkButton href={`/api/vacuum-tests/${id}/report?download=1`} variant="secondary" prefetch={false}>Download PDF</LinkButton>
      </div>
      <ReportView model={model} />
    </div>
  );
}
