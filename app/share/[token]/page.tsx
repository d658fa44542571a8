import type { Metadata } from "next";
import { db } from "@/db/client";
import { ReportView } from "@/components/review/ReportView";
import { buildReportModel } from "@/lib/reports/model";
import { resolveShareToken } from "@/lib/reports/share";

export const metadata: Metadata = { title: "Shared report", robots: { index: false, follow: false } };
export const dynamic = "force-dynamic";

function Gone({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <main className="mx-auto max-w-xl px-4 py-16 text-center">
      <h1 className="text-headline">{title}</h1>
      <p className="mt-2 text-body text-fg-soft">{children}</p>
    </main>
  );
}

/** A public, read-only view of one test's report. Nothing else of the organization is reachable from here. */
export default async function SharedReportPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const link = await resolveShareToken(db(), { token });
  if (link.status === "expired")
    return <Gone title="This link has expired">It stopped working on {link.expiresAt.toISOString().slice(0, 10)}. Ask the company that sent it for a new one.</Gone>;
  if (link.status === "revoked") return <Gone title="This link was withdrawn">The company that shared it has turned it off. Ask them for a new one.</Gone>;
  if (link.status !== "ok") return <Gone title="Link not found">Check that the whole address was copied.</Gone>;
  const model = await buildReportModel(db(), { organizationId: link.organizationId, testId: link.testId });
  if (!model) return <Gone title="Report not available">The test behind this link no longer exists.</Gone>;
  return (
    <main className="px-4 py-6 print:p-0">
      <ReportView model={model} />
      <p className="mx-auto mt-6 max-w-3xl text-caption text-fg-soft print:hidden">
        Read-only link, valid until {link.expiresAt.toISOString().slice(0, 10)}. <a className="underline" href={`/share/${token}/pdf`}>Download the PDF</a>.
      </p>
    </main>
  );
}
