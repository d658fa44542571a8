/** The report PDF attached to an outbox row, built at send time from the row's test. */
import type { Db } from "@/db/client";
import type { OutboxRow } from "@/db/queries/outbox";
import { buildReportModel } from "./model";
import { renderReportPdf } from "./pdf";

export function reportFilename(title: string): string {
  return `riseline-report-${title.replace(/[^A-Za-z0-9._-]+/g, "-").replace(/^-+|-+$/g, "").slice(0, 60) || "test"}.pdf`;
}

export async function reportAttachments(db: Db, row: OutboxRow) {
  if (!row.testId) throw new Error("report mail without a test");
  const model = await buildReportModel(db, { organizationId: row.organizationId, testId: row.testId });
  if (!model) throw new Error("the test of this report no longer exists");
  return [{ filename: reportFilename(model.title), content: await renderReportPdf(model), contentType: "application/pdf" }];
}
