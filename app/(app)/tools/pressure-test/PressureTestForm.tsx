"use client";

/**
 * Record a nitrogen standing-pressure test. The preview runs the server's own evaluation
 * (lib/pressure/evaluate.ts) in the browser, so the result — and a reading above the rated test
 * pressure, at the top of it — shows before Save; such a test saves only once acknowledged.
 */
import { useRouter } from "next/navigation";
import { useMemo, useRef, useState } from "react";
import { ABSOLUTE_UNIT_OF, NITROGEN_CAUTIONS, type NitrogenPressureUnit, type NitrogenResult, type TemperatureUnit } from "@/analysis/calculators/nitrogen";
import { inspectNitrogenLogHeader, type NitrogenLogHeader } from "@/analysis/calculators/nitrogen-log";
import { Alert, Button, Card, Input, Select } from "@/components/ui";
import { apiFetch, ApiError, newIdempotencyKey } from "@/lib/client/api";
import { evaluatePressureTestRequest } from "@/lib/pressure/evaluate";
import type { PressureTestCreate } from "@/lib/pressure/schemas";
import { AtmosphereFields, atmosphereBody, type AtmosphereState } from "./AtmosphereFields";
import { PressureResult } from "./PressureResult";
import { useUnits } from "@/lib/units/context";
import { UNIT_WORDS } from "./words";

const num = (s: string) => (s.trim() === "" ? NaN : Number(s.replace(",", ".")));
const isoOf = (local: string) => (local ? new Date(local).toISOString() : undefined);

interface Between {
  minutes: string;
  pressure: string;
}

export function PressureTestForm({ jobs }: { jobs: { id: string; label: string }[] }) {
  const router = useRouter();
  const [mode, setMode] = useState<"typed" | "file">("typed");
  const metric = useUnits() === "metric";
  // Opens in the reader's units (kPa gauge and °C for a metric shop); either can be changed.
  const [unit, setUnit] = useState<NitrogenPressureUnit>(metric ? "kpa_gauge" : "psig");
  const [tUnit, setTUnit] = useState<TemperatureUnit>(metric ? "C" : "F");
  const [p1, setP1] = useState("");
  const [t1, setT1] = useState("");
  const [p2, setP2] = useState("");
  const [t2, setT2] = useState("");
  const [between, setBetween] = useState<Between[]>([]);
  const [startedAt, setStartedAt] = useState("");
  const [endedAt, setEndedAt] = useState("");
  const [durationMin, setDurationMin] = useState("");
  const [rated, setRated] = useState("");
  const [atm, setAtm] = useState<AtmosphereState>({ mode: "standard", value: "", elevation: "", elevationUnit: "ft" });
  const [jobId, setJobId] = useState("");
  const [csv, setCsv] = useState<{ name: string; text: string } | null>(null);
  const [ambiguousAs, setAmbiguousAs] = useState<"" | "gauge" | "absolute">("");
  const [acknowledged, setAcknowledged] = useState(false);
  const [saved, setSaved] = useState<{ result: NitrogenResult; assumptions: string[] } | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  const header = useMemo((): { ok: NitrogenLogHeader } | { problem: string } | null => {
    if (mode !== "file" || !csv) return null;
    try {
      return { ok: inspectNitrogenLogHeader(csv.text) };
    } catch (e) {
      return { problem: (e as Error).message };
    }
  }, [mode, csv]);
  const testUnit: NitrogenPressureUnit | null = mode === "typed" ? unit : header && "ok" in header ? header.ok.unit.family : null;
  const needsAnswer = header !== null && "ok" in header && header.ok.unit.reference === null;

  const body = useMemo((): PressureTestCreate | null => {
    const common = {
      temperatureUnit: tUnit,
      jobId: jobId || null,
      ratedTestPressureGauge: Number.isFinite(num(rated)) && num(rated) > 0 ? num(rated) : null,
      ...atmosphereBody(atm),
      ...(startedAt ? { startedAt: isoOf(startedAt) } : {}),
    };
    if (mode === "file") {
      if (!csv) return null;
      return {
        source: "file",
        csvText: csv.text,
        ...(ambiguousAs ? { ambiguousAs } : {}),
        ...(Number.isFinite(num(t1)) && Number.isFinite(num(t2)) ? { startTemperature: num(t1), endTemperature: num(t2) } : {}),
        ...common,
      };
    }
    const v = [p1, t1, p2, t2].map(num);
    if (v.some((x) => !Number.isFinite(x))) return null;
    const readings = between.filter((b) => b.minutes.trim() !== "" || b.pressure.trim() !== "").map((b) => ({ minutes: num(b.minutes), pressureGauge: num(b.pressure) }));
    return {
      source: "typed",
      unit,
      start: { pressureGauge: v[0], temperature: v[1] },
      end: { pressureGauge: v[2], temperature: v[3] },
      ...(readings.length ? { readings } : {}),
      ...(startedAt && endedAt ? { endedAt: isoOf(endedAt) } : {}),
      ...(Number.isFinite(num(durationMin)) ? { durationMinutes: num(durationMin) } : {}),
      ...common,
    };
  }, [mode, csv, ambiguousAs, unit, tUnit, p1, t1, p2, t2, between, startedAt, endedAt, durationMin, rated, atm, jobId]);

  const preview = useMemo((): { result: NitrogenResult; assumptions: string[] } | { problem: string } | null => {
    if (!body || needsAnswer && !ambiguousAs) return null;
    if (body.source === "typed" && body.readings?.some((r) => !Number.isFinite(r.minutes) || !Number.isFinite(r.pressureGauge))) return { problem: "Each reading in between needs its minutes and its pressure." };
    try {
      const e = evaluatePressureTestRequest(body);
      return { result: e.result, assumptions: e.assumptions };
    } catch (e) {
      return { problem: (e as Error).message };
    }
  }, [body, needsAnswer, ambiguousAs]);
  const result = saved?.result ?? (preview && "result" in preview ? preview.result : null);
  const overPressure = Boolean(preview && "result" in preview && preview.result.overPressure);
  const hasWhen = mode === "file" || (startedAt && endedAt) || Number.isFinite(num(durationMin));

  const saveKey = useRef<string | null>(null);
  async function save() {
    if (!body) return;
    // One key per record: a retry or a second tap answers with the record already saved.
    const idempotencyKey = (saveKey.current ??= newIdempotencyKey());
    setError(null);
    setBusy(true);
    try {
      const res = await apiFetch<{ result: NitrogenResult; assumptions: string[] }>("/api/pressure-tests", {
        method: "POST",
        body: JSON.stringify({ ...body, ...(overPressure ? { overPressureAcknowledged: acknowledged } : {}) }),
      }, { idempotencyKey });
      setSaved(res);
      router.refresh();
    } catch (e) {
      setError(e instanceof ApiError ? e.message : String(e));
    } finally {
      setBusy(false);
    }
  }

  const edit = <T,>(set: (v: T) => void) => (v: T) => {
    set(v);
    saveKey.current = null;
    setSaved(null);
    setAcknowledged(false);
  };
  const pu = UNIT_WORDS[unit];
  const ratedUnit = testUnit ? UNIT_WORDS[testUnit] : "gauge, in the log's unit";
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
          <Button variant={mode === "typed" ? "primary" : "secondary"} role="radio" aria-checked={mode === "typed"} onClick={() => edit(setMode)("typed")}>
            Type readings
          </Button>
          <Button variant={mode === "file" ? "primary" : "secondary"} role="radio" aria-checked={mode === "file"} onClick={() => edit(setMode)("file")}>
            Logger CSV
          </Button>
        </div>
        <div className="grid gap-3 sm:grid-cols-2">
          {mode === "typed" && (
            <Select label="Pressure unit" value={unit} onChange={(e) => edit(setUnit)(e.target.value as NitrogenPressureUnit)} options={[{ value: "psig", label: "psig" }, { value: "kpa_gauge", label: "kPa gauge" }, { value: "bar_gauge", label: "bar gauge" }]} />
          )}
          <Select label="Temperature unit" value={tUnit} onChange={(e) => edit(setTUnit)(e.target.value as TemperatureUnit)} options={[{ value: "F", label: "°F" }, { value: "C", label: "°C" }]} />
          {mode === "typed" ? (
            <>
              <Input label={`Start pressure (${pu})`} inputMode="decimal" value={p1} onChange={(e) => edit(setP1)(e.target.value)} />
              <Input label={`Start temperature (°${tUnit})`} inputMode="decimal" value={t1} onChange={(e) => edit(setT1)(e.target.value)} hint="Ambient, or on the line" />
              <Input label={`End pressure (${pu})`} inputMode="decimal" value={p2} onChange={(e) => edit(setP2)(e.target.value)} />
              <Input label={`End temperature (°${tUnit})`} inputMode="decimal" value={t2} onChange={(e) => edit(setT2)(e.target.value)} />
              <Input label="Start time" type="datetime-local" value={startedAt} onChange={(e) => edit(setStartedAt)(e.target.value)} />
              <Input label="End time" type="datetime-local" value={endedAt} onChange={(e) => edit(setEndedAt)(e.target.value)} />
              <Input label="Or the duration (minutes)" inputMode="decimal" value={durationMin} onChange={(e) => edit(setDurationMin)(e.target.value)} hint="Give the start and end time, or how long the test ran" />
              <fieldset className="space-y-2 sm:col-span-2">
                <legend className="text-body font-medium">Readings in between (optional)</legend>
                {between.map((b, i) => (
                  <div key={i} className="flex items-end gap-2">
                    <Input className="flex-1" label={`Reading ${i + 1}: minutes from the start`} inputMode="decimal" value={b.minutes} onChange={(e) => edit(setBetween)(between.map((x, k) => (k === i ? { ...x, minutes: e.target.value } : x)))} />
                    <Input className="flex-1" label={`Reading ${i + 1}: pressure (${pu})`} inputMode="decimal" value={b.pressure} onChange={(e) => edit(setBetween)(between.map((x, k) => (k === i ? { ...x, pressure: e.target.value } : x)))} />
                  </div>
                ))}
                <Button variant="secondary" onClick={() => edit(setBetween)([...between, { minutes: "", pressure: "" }])}>
                  Add a reading
                </Button>
              </fieldset>
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
                    edit(setCsv)(f ? { name: f.name, text: await f.text() } : null);
                    setAmbiguousAs("");
                  }}
                />
                <p className="text-caption text-fg-soft">Every reading of the log is checked against the rated test pressure. The header should say gauge or absolute (psig, kPa g, bar g; psia, kPa abs); if it does not, Riseline asks.</p>
              </div>
              {header && "problem" in header && <Alert tone="error" className="sm:col-span-2">{header.problem}</Alert>}
              {header && "ok" in header && (
                <div className="sm:col-span-2" data-testid="log-unit">
                  {needsAnswer ? (
                    <Select
                      label={`The column '${header.ok.column}' says ${header.ok.unit.unitWord} but not gauge or absolute. Which does the logger record?`}
                      value={ambiguousAs}
                      onChange={(e) => edit(setAmbiguousAs)(e.target.value as "" | "gauge" | "absolute")}
                      options={[{ value: "", label: "Choose…" }, { value: "gauge", label: `Gauge (${header.ok.unit.unitWord} above the atmosphere)` }, { value: "absolute", label: `Absolute (${header.ok.unit.unitWord} above a perfect vacuum)` }]}
                    />
                  ) : (
                    <p className="text-body">Column ‘{header.ok.column}’: read as {header.ok.unit.reference}, as its header says.</p>
                  )}
                </div>
              )}
              <Input label={`Start temperature (°${tUnit}), if the log has none`} inputMode="decimal" value={t1} onChange={(e) => edit(setT1)(e.target.value)} />
              <Input label={`End temperature (°${tUnit}), if the log has none`} inputMode="decimal" value={t2} onChange={(e) => edit(setT2)(e.target.value)} />
              <Input label="Start time, if the log's clock has none" type="datetime-local" value={startedAt} onChange={(e) => edit(setStartedAt)(e.target.value)} />
            </>
          )}
          <Input label={`Rated test pressure (${ratedUnit})`} inputMode="decimal" value={rated} onChange={(e) => edit(setRated)(e.target.value)} hint="The lowest rating of the system's parts, from the nameplate" />
          <AtmosphereFields state={atm} onChange={edit(setAtm)} unit={testUnit ? ABSOLUTE_UNIT_OF[testUnit] : null} />
          {jobs.length > 0 && <Select label="Job (optional)" value={jobId} onChange={(e) => edit(setJobId)(e.target.value)} options={[{ value: "", label: "No job" }, ...jobs.map((j) => ({ value: j.id, label: j.label }))]} />}
        </div>
      </Card>
      {preview && "problem" in preview && !saved && <Alert tone="error" title="Check the readings">{preview.problem}</Alert>}
      {result && <PressureResult result={result} saved={Boolean(saved)} assumptions={saved?.assumptions ?? (preview && "result" in preview ? preview.assumptions : [])} />}
      {!saved && (
        <Card>
          {overPressure && (
            <label className="mb-3 flex items-start gap-3 text-body">
              <input type="checkbox" className="mt-1 h-6 w-6 shrink-0" checked={acknowledged} onChange={(e) => setAcknowledged(e.target.checked)} />
              <span>I have released the pressure through the regulator, and I record that this test went above the system&apos;s rated test pressure. The equipment maker&apos;s instructions and local codes decide what must be checked before testing again.</span>
            </label>
          )}
          {mode === "typed" && !hasWhen && <p className="mb-2 text-caption text-fg-soft">Give the start and end time, or the duration, to save.</p>}
          <Button block busy={busy} disabled={!preview || "problem" in preview || !hasWhen || (overPressure && !acknowledged)} onClick={save}>
            {overPressure ? "Save the stopped test" : "Save the test"}
          </Button>
        </Card>
      )}
      {error && <Alert tone="error" title="Not saved">{error}</Alert>}
    </div>
  );
}
