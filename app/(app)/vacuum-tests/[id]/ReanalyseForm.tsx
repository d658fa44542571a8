"use client";

import { useRef, useState } from "react";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { AnalysisResult, PressureUnit } from "@/analysis/decay/types";
import { Alert, Button, Card, Input, Select } from "@/components/ui";
import { listProfiles, newIdempotencyKey, reanalyse, type ReanalyseBody } from "@/lib/client/api";
import { UNIT_LABELS } from "../new/ColumnChooser";
import { durationWords } from "./format";

interface Props {
  testId: string;
  analysis: AnalysisResult;
  /** Unit and time-unit overrides only make sense for an uploaded file. */
  fromFile: boolean;
  /** Isolation picked on the chart (seconds from the first reading). */
  pickedSeconds: number | null;
  onPick: (seconds: number | null) => void;
}

function toNumber(s: string): number | null {
  const v = Number(s.trim().replace(",", "."));
  return s.trim() !== "" && Number.isFinite(v) ? v : null;
}

/**
 * Run the analysis again with overrides. Every run adds a version; earlier ones stay in
 * the history. Isolation can be typed (minutes or seconds) or tapped on the chart.
 */
export function ReanalyseForm({ testId, analysis, fromFile, pickedSeconds, onPick }: Props) {
  const queryClient = useQueryClient();
  const [isolation, setIsolation] = useState("");
  const [isoUnit, setIsoUnit] = useState<"min" | "s">("min");
  const [holdStart, setHoldStart] = useState("");
  const [holdEnd, setHoldEnd] = useState("");
  const [unit, setUnit] = useState<"" | PressureUnit>("");
  const [profileId, setProfileId] = useState("");
  const [reason, setReason] = useState("");
  const [problem, setProblem] = useState<string | null>(null);
  const lastAttempt = useRef<{ body: string; key: string } | null>(null);
  const profiles = useQuery({ queryKey: ["profiles"], queryFn: listProfiles, retry: 1 });

  // A tap on the chart fills the isolation field (unless it already says that time).
  const [seenPick, setSeenPick] = useState(pickedSeconds);
  if (pickedSeconds !== seenPick) {
    setSeenPick(pickedSeconds);
    const typed = toNumber(isolation);
    const typedSeconds = typed === null ? null : isoUnit === "min" ? typed * 60 : typed;
    if (pickedSeconds != null && typedSeconds !== pickedSeconds)
      setIsolation(isoUnit === "min" ? String(Math.round((pickedSeconds / 60) * 100) / 100) : String(Math.round(pickedSeconds)));
  }

  const mutation = useMutation({
    mutationFn: ({ body, key }: { body: ReanalyseBody; key: string }) => reanalyse(testId, body, key),
    onSuccess: async () => {
      lastAttempt.current = null;
      setIsolation("");
      setHoldStart("");
      setHoldEnd("");
      setReason("");
      onPick(null);
      await queryClient.invalidateQueries({ queryKey: ["test", testId] });
      queryClient.invalidateQueries({ queryKey: ["tests"] });
    },
  });

  const submit = (e: React.FormEvent) => {
    e.preventDefault();
    setProblem(null);
    const body: ReanalyseBody = {};
    const iso = toNumber(isolation);
    if (isolation.trim() && iso === null) return setProblem("Isolation time: type a number, e.g. 24.5.");
    if (iso !== null) body.isolationAtSeconds = isoUnit === "min" ? iso * 60 : iso;
    const hs = toNumber(holdStart);
    const he = toNumber(holdEnd);
    if ((holdStart.trim() || holdEnd.trim()) && (hs === null || he === null)) return setProblem("Hold window: give both start and end in minutes.");
    if (hs !== null && he !== null) {
      if (he <= hs) return setProblem("Hold window: the end must be after the start.");
      body.holdWindow = { startSeconds: hs * 60, endSeconds: he * 60 };
    }
    if (unit) body.unit = unit;
    if (profileId) body.profileId = profileId;
    if (reason.trim()) body.reason = reason.trim();
    if (Object.keys(body).filter((k) => k !== "reason").length === 0) return setProblem("Change at least one thing: isolation, hold window, unit or profile.");
    const json = JSON.stringify(body);
    const key = lastAttempt.current?.body === json ? lastAttempt.current.key : newIdempotencyKey();
    lastAttempt.current = { body: json, key };
    mutation.mutate({ body, key });
  };

  const lastSeconds = analysis.holds.length ? analysis.holds[analysis.holds.length - 1].endSeconds : null;

  return (
    <Card title="Analyse again">
      <form onSubmit={submit} className="space-y-4" data-testid="reanalyse-form" noValidate>
        <p className="text-body text-fg-soft">
          Found isolation: <span className="font-semibold text-fg">{analysis.isolationAt != null ? `${durationWords(analysis.isolationAt)} from the start` : "none"}</span>.
          Tap the chart or type a time to move it. Each run is kept as a new version.
        </p>
        <div className="flex items-end gap-2">
          <Input
            label="Isolation time"
            inputMode="decimal"
            placeholder={analysis.isolationAt != null ? (isoUnit === "min" ? String(Math.round((analysis.isolationAt / 60) * 100) / 100) : String(Math.round(analysis.isolationAt))) : ""}
            value={isolation}
            onChange={(e) => {
              setIsolation(e.target.value);
              const v = toNumber(e.target.value);
              onPick(v === null ? null : isoUnit === "min" ? v * 60 : v);
            }}
            className="flex-1"
          />
          <Select
            label="In"
            value={isoUnit}
            onChange={(e) => {
              const u = e.target.value as "min" | "s";
              setIsoUnit(u);
              const v = toNumber(isolation);
              onPick(v === null ? null : u === "min" ? v * 60 : v);
            }}
            className="w-28"
          >
            <option value="min">min</option>
            <option value="s">sec</option>
          </Select>
        </div>
        <fieldset className="grid grid-cols-2 gap-2">
          <legend className="mb-1 text-body font-medium">Hold window (minutes from the start, optional)</legend>
          <Input label="From" inputMode="decimal" value={holdStart} onChange={(e) => setHoldStart(e.target.value)} />
          <Input label="To" inputMode="decimal" value={holdEnd} onChange={(e) => setHoldEnd(e.target.value)} placeholder={lastSeconds != null ? String(Math.round(lastSeconds / 6) / 10) : ""} />
        </fieldset>
        {fromFile && (
          <Select label="Read the pressure as" value={unit} onChange={(e) => setUnit(e.target.value as "" | PressureUnit)} hint={`Now read as ${UNIT_LABELS[analysis.import.unit] ?? analysis.import.unit}.`}>
            <option value="">Keep {UNIT_LABELS[analysis.import.unit] ?? analysis.import.unit}</option>
            {(Object.keys(UNIT_LABELS) as PressureUnit[]).map((u) => <option key={u} value={u}>{UNIT_LABELS[u]}</option>)}
          </Select>
        )}
        <Select label="Acceptance profile" value={profileId} onChange={(e) => setProfileId(e.target.value)} hint={profiles.isError ? "Profiles could not be loaded." : undefined}>
          <option value="">Keep “{analysis.profile.name}”</option>
          {/* The built-in default (id null) is not a profile one can pick to re-check with. */}
          {profiles.data?.flatMap((p) => (p.id === null ? [] : [<option key={p.id} value={p.id}>{p.name}</option>]))}
        </Select>
        <Input label="Reason (kept in the history)" value={reason} onChange={(e) => setReason(e.target.value)} placeholder="e.g. pump valved off later than detected" />
        {problem && <Alert tone="error">{problem}</Alert>}
        {mutation.isError && (
          <Alert tone="error" title="Not analysed">
            {(mutation.error as Error).message} Send again; it will not be saved twice.
          </Alert>
        )}
        {mutation.isSuccess && (
          <Alert tone="success" title={`Version ${mutation.data.version} saved`}>
            The verdict above is the new one. Earlier versions are kept in the history.
          </Alert>
        )}
        <Button type="submit" size="lg" block busy={mutation.isPending}>Analyse again</Button>
      </form>
    </Card>
  );
}
