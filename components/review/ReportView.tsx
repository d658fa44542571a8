import type { ReportModel } from "@/lib/reports/model";
import { reportDocument, type Block } from "@/lib/reports/document";
import { ReportCurveSvg } from "./ReportCurveSvg";

function BlockView({ block, model }: { block: Block; model: ReportModel }) {
  switch (block.kind) {
    case "paragraph":
      return (
        <p className={block.tone === "strong" ? "text-lead font-semibold" : block.tone === "muted" ? "text-fg-soft" : undefined} data-testid={block.testId}>
          {block.text}
        </p>
      );
    case "rows":
      return (
        <dl data-testid={block.testId}>
          {block.rows.map(([k, v]) => (
            <div key={k + v} className="grid grid-cols-[10rem_1fr] gap-2 py-0.5 print:grid-cols-[9rem_1fr]">
              <dt className="text-fg-soft">{k}</dt>
              <dd className="break-words">{v}</dd>
            </div>
          ))}
        </dl>
      );
    case "numbers":
      return (
        <dl data-testid="report-numbers">
          {block.rows.map((r) => (
            <div key={r.label} className="grid grid-cols-[10rem_1fr] gap-2 py-0.5 print:grid-cols-[9rem_1fr]">
              <dt className="text-fg-soft">{r.label}</dt>
              <dd>
                <span className="tabular-nums" data-testid="report-number" data-label={r.label}>{r.value}</span>
                <span className="block text-caption text-fg-soft">{r.definition}</span>
              </dd>
            </div>
          ))}
        </dl>
      );
    case "list": {
      const L = block.numbered ? "ol" : "ul";
      return (
        <L className={`${block.numbered ? "list-decimal" : "list-disc"} space-y-1 pl-5`} data-testid={block.testId}>
          {block.items.map((i) => (
            <li key={i}>{i}</li>
          ))}
        </L>
      );
    }
    case "finding":
      return (
        <div className="break-inside-avoid">
          <p className="font-semibold">{block.title}</p>
          <p>{block.message}</p>
          {block.checks.length > 0 && (
            <>
              <p className="text-fg-soft">Check, in this order:</p>
              <ol className="list-decimal pl-5 text-fg-soft">
                {block.checks.map((c) => (
                  <li key={c}>{c}</li>
                ))}
              </ol>
            </>
          )}
        </div>
      );
    case "curve":
      return model.curve ? <ReportCurveSvg curve={model.curve} /> : null;
  }
}

/**
 * The printable report of one test: the sections of lib/reports/document.ts, the same the PDF
 * draws. Server-rendered, no scripts, so the share page shows exactly this and nothing else of the
 * organization; it is the customer's copy, so it never carries the internal notes.
 */
export function ReportView({ model }: { model: ReportModel }) {
  const doc = reportDocument(model);
  return (
    <article className="report mx-auto max-w-3xl space-y-6 text-body print:max-w-none print:space-y-4 print:text-[11pt]" data-testid="report">
      <header>
        <p className="text-fg-soft">{doc.organizationName}</p>
        <h1 className="text-headline">{doc.title}</h1>
        <p className="text-lead">{doc.subtitle}</p>
        {doc.practice && <p className="text-fg-soft">{doc.practice}</p>}
      </header>
      {doc.sections.map((s) => (
        <section key={s.id} aria-labelledby={`r-${s.id}`} className="break-inside-avoid space-y-1" data-testid={`report-section-${s.id}`}>
          <h2 id={`r-${s.id}`} className="text-title">{s.heading}</h2>
          {s.blocks.map((b, i) => (
            <BlockView key={i} block={b} model={model} />
          ))}
        </section>
      ))}
      <footer className="space-y-1 text-caption text-fg-faint" data-testid="report-footer">
        {doc.footer.map((f) => (
          <p key={f} className="break-all">{f}</p>
        ))}
      </footer>
    </article>
  );
}
