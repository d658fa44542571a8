"use client";

import { useRouter } from "next/navigation";
import { useMemo, useState } from "react";
import { evaluateNitrogenTest, NITROGEN_CAUTIONS, STANDARD_ATMOSPHERE, type NitrogenPressureUnit, type NitrogenResult, type TemperatureUnit } from "@/analysis/nitrogen";
import { Alert, Badge, Button, Card, Input, Select } from "@/components/ui";
import { apiFetch, ApiError } from "@/lib/client/api";
import { UNIT_WORDS, VERDICT_WORDS } from "./words";

const num = (s: string) => (s.trim() === "" ? NaN : Number(s.replace(",", ".")));

function Steps({ result }: { result: NitrogenResult }) {
  return (
    <ol className="space-y-1 text-body" aria-label="The correction worked out">
      {result.steps.map((s) => (
        <li key={s.key} className="flex flex-wrap justify-between gap-x-3 border-b border-surface-line py-1">
          <span className="text-fg-soft">{s.label}</span>
          <span className="font-mono text-caption sm:text-body">
            {s.expression} = <strong>{s.value.toFixed(s.displayDigits)}</strong> {s.unit}
          </span>
        </li>
      ))}
    </ol>
  );
}

export function PressureTestForm({ jobs }: { jobs: { id: string; label: string }[] }) {
  const router = useRouter();
  const [mode, setMode] = useState<"typed" | "file">("typed");
  const [unit, setUnit] = useState<NitrogenPressureUnit>("psig");
  const [tUnit, setTUnit] = useState<TemperatureUnit>("F");
  const [p1, setP1] = useState("");
  const [t1, setT1] = useState("");
  const [p2, setP2] = useState("");
  const [t2, setT2] = useState("");
  const [rated, setRated] = useState("");
  const [atm, setAtm] = useState("");
  const [jobId, setJobId] = useState("");
  const [csv, setCsv] = useState<{ name: string; text: string } | null>(null);
  const [ambiguousAs, setAmbiguousAs] = useState<"" | "gauge" | "absolute">("");
  const [saved, setSaved] = useState<{ result: NitrogenResult; assumptions: string[] } | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  const preview = useMemo(() => {
    if (mode !== "typed") return null;
    const v = [p1, t1, p2, t2].map(num);
    if (v.some((x) => !Number.isFinite(x))) return null;
    try {
      return evaluateNitrogenTest({
        unit,
        temperatureUnit: tUnit,
        start: { pressureGauge: v[0], temperature: v[1] },
        end: { pressureGauge: v[2], temperature: v[3] },
        ratedTestPressureGauge: Number.isFinite(num(rated)) ? num(rated) : null,
        atmosphereAbs: Number.isFinite(num(atm)) ? num(atm) : undefined,
      });
    } catch {
      return null;
    }
  }, [mode, unit, tUnit, p1, t1, p2, t2, rated, atm]);

  async function save() {
    setError(null);
    setBusy(true);
    const common = {
      temperatureUnit: tUnit,
      jobId: jobId || null,
      ratedTestPressureGauge: Number.isFinite(num(rated)) ? num(rated) : null,
      ...(Number.isFinite(num(atm)) ? { atmosphereAbs: num(atm) } : {}),
    };
    const body =
      mode === "typed"
        ? { source: "typed", unit, start: { pressureGauge: num(p1), temperature: num(t1) }, end: { pressureGauge: num(p2), temperature: num(t2) }, ...common }
        : {
            source: "file",
            csvText: csv?.text ?? "",
            ...(ambiguousAs ? { ambiguousAs } : {}),
            ...(Number.isFinite(num(t1)) && Number.isFinite(num(t2)) ? { startTemperature: num(t1), endTemperature: num(t2) } : {}),
            ...common,
          };
    try {
      const res = await apiFetch<{ result: NitrogenResult; assumptions: string[] }>("/api/pressure-tests", { method: "POST", body: JSON.stringify(body) });
      setSaved(res);
      router.refresh();
    } catch (e) {
      setError(e instanceof ApiError ? e.message : String(e));
    } finally {
      setBusy(false);
    }
  }

  const shown = saved?.result ?? preview;
  const pu = UNIT_WORDS[unit];
  return (
    <div className="space-y-4">
      <Alert tone="warning" title="Before you pressurise">
        <ul className="list-disc pl-5">
          {NITROGEN_CAUTIONS.map((c) => (
            <li key={c}>{c}</li>
          ))}
        </ul>
      </Alert>
      <Card title="Readings">
        <div className="mb-3 flex gap-2" role="radiogroup" aria-label="How to enter the test">
          <Button variant={mode === "typed" ? "primary" : "secondary"} role="radio" aria-checked={mode === "typed"} onClick={() => setMode("typed")}>
            Type readings
          </Button>
          <Button variant={mode === "file" ? "primary" : "secondary"} role="radio" aria-checked={mode === "file"} onClick={() => setMode("file")}>
            Logger CSV
          </Button>
        </div>
        <div className="grid gap-3 sm:grid-cols-2">
          {mode === "typed" && (
            <Select label="Pressure unit" value={unit} onChange={(e) => setUnit(e.target.value as NitrogenPressureUnit)} options={[{ value: "psig", label: "psig" }, { value: "kpa_gauge", label: "kPa gauge" }, { value: "bar_gauge", label: "bar gauge" }]} />
          )}
          <Select label="Temperature unit" value={tUnit} onChange={(e) => setTUnit(e.target.value as TemperatureUnit)} options={[{ value: "F", label: "°F" }, { value: "C", label: "°C" }]} />
          {mode === "typed" ? (
            <>
              <Input label={`Start pressure (${pu})`} inputMode="decimal" value={p1} onChange={(e) => setP1(e.target.value)} />
              <Input label={`Start temperature (°${tUnit})`} inputMode="decimal" value={t1} onChange={(e) => setT1(e.target.value)} hint="Ambient, or on the line" />
              <Input label={`End pressure (${pu})`} inputMode="decimal" value={p2} onChange={(e) => setP2(e.target.value)} />
              <Input label={`End temperature (°${tUnit})`} inputMode="decimal" value={t2} onChange={(e) => setT2(e.target.value)} />
            </>
          ) : (
            <>
              <div className="flex flex-col gap-1.5 sm:col-span-2">
                <label htmlFor="n2-csv" className="text-body font-medium">Logger CSV</label>
                <input
                  id="n2-csv"
                  type="file"
                  accept=".csv,.txt,text/csv,text/plain"
                  className="min-h-tap text-body"
                  onChange={async (e) => {
                    const f = e.target.files?.[0];
                    setCsv(f ? { name: f.name, text: await f.text() } : null);
                  }}
                />
                <p className="text-caption text-fg-soft">The header must name the unit: psig, kPa g and bar g are gauge; psia and kPa are absolute and are turned into gauge with the atmosphere.</p>
              </div>
              <Select label="If the header says only “psi” or “bar”" value={ambiguousAs} onChange={(e) => setAmbiguousAs(e.target.value as "" | "gauge" | "absolute")} options={[{ value: "", label: "Ask me" }, { value: "gauge", label: "It is gauge" }, { value: "absolute", label: "It is absolute" }]} />
              <Input label={`Start temperature (°${tUnit}), if the log has none`} inputMode="decimal" value={t1} onChange={(e) => setT1(e.target.value)} />
              <Input label={`End temperature (°${tUnit}), if the log has none`} inputMode="decimal" value={t2} onChange={(e) => setT2(e.target.value)} />
            </>
          )}
          <Input label="Rated test pressure (nameplate, gauge)" inputMode="decimal" value={rated} onChange={(e) => setRated(e.target.value)} hint="The lowest rating of the system's parts" />
          <Input label={`Atmosphere (absolute), default ${STANDARD_ATMOSPHERE[unit]}`} inputMode="decimal" value={atm} onChange={(e) => setAtm(e.target.value)} hint="Only at altitude" />
          {jobs.length > 0 && <Select label="Job (optional)" value={jobId} onChange={(e) => setJobId(e.target.value)} options={[{ value: "", label: "No job" }, ...jobs.map((j) => ({ value: j.id, label: j.label }))]} />}
        </div>
        <Button className="mt-4" block busy={busy} disabled={mode === "typed" ? !preview : !csv} onClick={save}>
          Save the test
        </Button>
      </Card>
      {error && <Alert tone="error" title="Not saved">{error}</Alert>}
      {shown && (
        <Card title={saved ? "Saved" : "Result"} data-testid="pressure-result">
          {shown.warnings.map((w) => (
            <Alert key={w.code} tone={w.code === "above_rated_pressure" ? "error" : "warning"} className="mb-3">
              {w.message}
            </Alert>
          ))}
          <div className="flex flex-wrap items-center gap-3">
            <Badge tone={shown.verdict === "holds" ? "pass" : shown.verdict === "drops" ? "leak" : "attention"} className="text-body">
              {VERDICT_WORDS[shown.verdict]}
            </Badge>
            <span className="text-body">
              Expected end <strong data-testid="expected-end">{shown.expectedEndGauge.toFixed(2)}</strong> {shown.steps.find((s) => s.key === "p2_gauge")?.unit}
            </span>
          </div>
          <p className="mt-2 text-body">{shown.summary}</p>
          <div className="mt-3">
            <Steps result={shown} />
          </div>
          {saved?.assumptions.map((a) => (
            <p key={a} className="mt-2 text-caption text-fg-soft">{a}</p>
          ))}
        </Card>
      )}
    </div>
  );
}
