import { reportFilename } from "./attach";
import type { ReportModel } from "./model";
import { renderReportPdf } from "./pdf";

/** A PDF response for a report; `inline` opens in the browser, otherwise it downloads. */
export async function pdfResponse(model: ReportModel, inline: boolean): Promise<Response> {
  const bytes = await renderReportPdf(model);
  return new Response(new Uint8Array(bytes), {
    headers: {
      "content-type": "application/pdf",
      "content-disposition": `${inline ? "inline" : "attachment"}; filename="${reportFilename(model.title)}"`,
      "cache-control": "private, no-store",
    },
  });
}
