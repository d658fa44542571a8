import type { ReportModel } from "@/lib/reports/model";
import { ReportCurveSvg } from "./ReportCurveSvg";

function Row({ k, v }: { k: string; v: string | null | undefined }) {
  if (v == null || v === "") return null;
  return (
    <div className="grid grid-cols-[10rem_1fr] gap-2 py-0.5 print:grid-cols-[9rem_1fr]">
      <dt className="text-fg-soft">{k}</dt>
      <dd>{v}</dd>
    </div>
  );
}

const when = (iso: string) => new Date(iso).toLocaleString("en-US", { dateStyle: "long", timeStyle: "short", timeZone: "UTC" }) + " UTC";

/**
 * The printable report of one test (the same model as the PDF). Server-rendered, no scripts,
 * so the share page shows exactly this and nothing else of the organization.
 */
export function ReportView({ model: m }: { model: ReportModel }) {
  const pass = m.verdict === "pass";
  return (
    <article className="report mx-auto max-w-3xl space-y-6 text-body print:max-w-none print:space-y-4 print:text-[11pt]" data-testid="report">
      <header>
        <p className="text-fg-soft">{m.organizationName}</p>
        <h1 className="text-headline">Evacuation and decay test report</h1>
        <p className="text-lead">{m.title}</p>
        {m.isPractice && <p className="text-fg-soft">Practice test (training record, not a job record).</p>}
      </header>

      <section aria-labelledby="r-verdict" className={`rounded-card border-2 p-4 ${pass ? "border-verdict-pass" : "border-verdict-leak"}`}>
        <h2 id="r-verdict" className="text-title">Verdict: {m.verdictWords}</h2>
        {m.meetsProfile != null && m.profile && (
          <p>
            {m.meetsProfile ? "Meets" : "Does not meet"} the acceptance profile “{m.profile.name}”.
          </p>
        )}
        {m.confidence != null && <p className="text-fg-soft">Confidence {Math.round(m.confidence * 100)} %.</p>}
      </section>

      <section aria-labelledby="r-job" className="break-inside-avoid">
        <h2 id="r-job" className="text-title">The job</h2>
        <dl>
          <Row k="Customer" v={m.customerName} />
          <Row k="Site" v={m.siteName} />
          <Row k="Address" v={m.siteAddress} />
          <Row k="System" v={m.system ? [m.system.name, m.system.kind].filter(Boolean).join(", ") : null} />
          <Row k="Refrigerant" v={m.refrigerant} />
          <Row k="Line set" v={m.system?.lineSetFeet ? `${m.system.lineSetFeet} ft, ${m.system.liquidOd ?? "?"} in. liquid / ${m.system.suctionOd ?? "?"} in. suction` : null} />
          <Row k="Technician" v={m.technicianName} />
          <Row k="Tested" v={when(m.testedAt)} />
          <Row k="Rig" v={m.rigNote} />
          <Row k="Notes" v={m.notes} />
        </dl>
      </section>

      {m.curve && (
        <section aria-labelledby="r-curve" className="break-inside-avoid">
          <h2 id="r-curve" className="text-title">The curve</h2>
          <ReportCurveSvg curve={m.curve} />
          <p className="text-caption text-fg-soft">Shaded: the hold after isolation. Dashed red: the profile&apos;s limit. Dashed green: isolation.</p>
        </section>
      )}

      <section aria-labelledby="r-numbers" className="break-inside-avoid">
        <h2 id="r-numbers" className="text-title">The numbers</h2>
        <dl>
          {m.numbers.map((n) => (
            <Row key={n.label} k={n.label} v={n.value} />
          ))}
        </dl>
      </section>

      {m.profile && (
        <section aria-labelledby="r-profile" className="break-inside-avoid">
          <h2 id="r-profile" className="text-title">Acceptance profile: {m.profile.name}</h2>
          <p>
            Isolate at or below {m.profile.targetMicrons} microns, hold {m.profile.holdMinutes} min, stay at or below {m.profile.limitMicrons} microns, steady climb under{" "}
            {m.profile.leakRateMicronsPerMinute} microns/min.
          </p>
          <ul className="mt-1">
            {m.profileRules.map((r) => (
              <li key={r.label}>
                <strong>{r.met ? "Met" : "Not met"}:</strong> {r.label} ({r.detail})
              </li>
            ))}
          </ul>
        </section>
      )}

      {m.findings.length > 0 && (
        <section aria-labelledby="r-findings">
          <h2 id="r-findings" className="text-title">Findings</h2>
          <ul className="space-y-2">
            {m.findings.map((f, i) => (
              <li key={i} className="break-inside-avoid">
                <p className="font-semibold">{f.title}</p>
                <p>{f.message}</p>
                {f.checks.length > 0 && <p className="text-fg-soft">Check: {f.checks.join("; ")}</p>}
              </li>
            ))}
          </ul>
        </section>
      )}

      <section aria-labelledby="r-signoff" className="break-inside-avoid">
        <h2 id="r-signoff" className="text-title">Sign-off</h2>
        <p data-testid="report-signoff">{m.signOff ? `Signed off by ${m.signOff.by} on ${when(m.signOff.at)}.${m.signOff.note ? ` ${m.signOff.note}` : ""}` : "Not signed off."}</p>
      </section>

      <section aria-labelledby="r-cautions" className="break-inside-avoid">
        <h2 id="r-cautions" className="text-title">Cautions</h2>
        <ul className="list-disc space-y-1 pl-5 text-caption">
          {m.cautions.map((c) => (
            <li key={c}>{c}</li>
          ))}
        </ul>
      </section>
      <footer className="text-caption text-fg-faint">
        Made with Riseline{m.engineVersion ? ` (analysis ${m.engineVersion})` : ""}. Test id {m.testId}.
      </footer>
    </article>
  );
}
