"use client";

import { useState } from "react";
import { useQueryClient } from "@tanstack/react-query";
import { testKeys } from "@/lib/client/queries";
import { Alert, Button, LinkButton } from "@/components/ui";
import {
  ApiError,
  createTestFromReadings,
  isOffline,
  newIdempotencyKey,
  uploadTest,
  previewImport,
  type CreatedTest,
  type ImportPreview,
} from "@/lib/client/api";
import dynamic from "next/dynamic";
import type { ColumnChoice } from "./ColumnChooser";
import { ContextFields } from "./ContextFields";
import { EMPTY_CONTEXT, appendContext, contextFields, type TestContext } from "./context";
import { DropZone, MAX_UPLOAD_BYTES } from "./DropZone";
import { NewVisit } from "./NewVisit";
import { adviseOnError } from "./errors";
import { useUnits } from "@/lib/units/context";
import type { TimeMode } from "./readings";
import type { TaskProgress, UploadAnswer } from "@/lib/client/tasks";

// Loaded when needed, to keep this page's first load small for a weak signal.
const Loading = () => (
  <div className="py-6 text-fg-soft" role="status">
    Loading…
  </div>
);
const ColumnChooser = dynamic(() => import("./ColumnChooser").then((m) => m.ColumnChooser), { loading: Loading });
const TypedReadings = dynamic(() => import("./TypedReadings").then((m) => m.TypedReadings), { loading: Loading });
const UploadResult = dynamic(() => import("./UploadResult").then((m) => m.UploadResult), { loading: Loading });
const AnalysisWait = dynamic(() => import("./AnalysisWait").then((m) => m.AnalysisWait), { loading: Loading });
// The phone's outbox (IndexedDB) and engine load apart from the page, too.
const OfflineOutbox = dynamic(() => import("@/components/offline/OfflineOutbox").then((m) => m.OfflineOutbox), { ssr: false });

type Phase =
  | { kind: "pick" }
  | { kind: "checking"; file: File }
  | { kind: "choose"; file: File; preview: ImportPreview }
  | { kind: "sending"; file?: File; progress: number | null }
  | { kind: "error"; error: unknown; file?: File; retry: () => void }
  | { kind: "queued"; task: TaskProgress; file?: File; name: string; retry: () => void }
  | { kind: "done"; created: CreatedTest };

/** What is being sent; a retry sends the same thing with the same key. */
type Attempt =
  | { source: "file"; file: File; choice?: ColumnChoice; key: string }
  | { source: "typed"; readings: { time: string | number; microns: number }[]; mode: TimeMode; key: string };

/** The preview needs only the header and first rows: send at most 256 KB, cut at a line end. */
const PREVIEW_BYTES = 256 * 1024;

async function previewPart(file: File): Promise<Blob> {
  if (file.size <= PREVIEW_BYTES) return file;
  const text = await file.slice(0, PREVIEW_BYTES).text();
  const cut = text.lastIndexOf("\n");
  return new Blob([cut > 0 ? text.slice(0, cut + 1) : text], { type: file.type || "text/csv" });
}

/** Column or unit problems the technician can settle by choosing; the server sends the first rows along. */
const CHOOSABLE = new Set(["no_time_column", "no_pressure_column", "unknown_unit"]);

function chooserFromError(error: unknown): ImportPreview | null {
  if (!(error instanceof ApiError) || error.status !== 422 || !CHOOSABLE.has(String(error.details?.reason))) return null;
  const columns = error.details?.columns;
  const rows = error.details?.rows;
  if (!Array.isArray(columns) || columns.length < 2 || !Array.isArray(rows)) return null;
  return {
    columns: columns.map(String),
    rows: rows as string[][],
    detected: { timeColumn: null, pressureColumn: null, unit: null, timeFormat: null, unsure: true, assumptions: [error.message] },
  };
}

export interface NewTestProps {
  /** The signed-in member's name (the technician of a new visit). */
  technicianName: string;
  /** records.manage: may make a new visit (job) with the test. */
  canCreateJob: boolean;
  /** The signed-in member: the phone's outbox is theirs. */
  userId: string;
}

export function NewTest({ technicianName, canCreateJob, userId }: NewTestProps) {
  const [tab, setTab] = useState<"file" | "typed">("file");
  const [phase, setPhase] = useState<Phase>({ kind: "pick" });
  const units = useUnits();
  const [context, setContext] = useState<TestContext>(() => ({ ...EMPTY_CONTEXT, ambientUnit: units === "metric" ? "C" : "F", lengthUnit: units === "metric" ? "m" : "ft" }));
  const queryClient = useQueryClient();

  /** No signal: the capture goes to the phone's outbox (its key made there) and is judged on the phone. */
  const keepOnPhone = async (a: { source: "file"; file: File } | { source: "typed"; readings: Extract<Attempt, { source: "typed" }>["readings"]; mode: TimeMode }) => {
    const { captureOffline } = await import("@/lib/offline/capture");
    setPhase({ kind: "pick" });
    await captureOffline(userId, a.source === "file" ? a : { source: "typed", readings: a.readings, timeMode: a.mode }, contextFields(context));
  };

  const send = async (a: Attempt) => {
    const file = a.source === "file" ? a.file : undefined;
    if (isOffline() && !(a.source === "file" && a.choice)) return keepOnPhone(a.source === "file" ? { source: "file", file: a.file } : a);
    setPhase({ kind: "sending", file, progress: a.source === "file" ? 0 : null });
    try {
      if (isOffline()) throw new ApiError(0, "offline", "You are offline.");
      let answer: UploadAnswer;
      if (a.source === "file") {
        const form = new FormData();
        form.set("file", a.file, a.file.name);
        if (a.choice) {
          form.set("timeColumn", a.choice.timeColumn);
          form.set("pressureColumn", a.choice.pressureColumn);
          form.set("unit", a.choice.unit);
          if (a.choice.timeUnit) form.set("timeUnit", a.choice.timeUnit);
          if (a.choice.decimalMark) form.set("decimalMark", a.choice.decimalMark);
        }
        appendContext(form, context);
        // A plain call, not useMutation: the page's phases already hold its state, and the
        // mutation observer would add about 2.5 kB (gzip) to this page's first load.
        answer = (await uploadTest(form, {
          idempotencyKey: a.key,
          onProgress: (f) => setPhase((p) => (p.kind === "sending" ? { ...p, progress: f } : p)),
        })) as UploadAnswer;
      } else {
        answer = (await createTestFromReadings({ readings: a.readings, timeMode: a.mode, ...contextFields(context) }, a.key)) as UploadAnswer;
      }
      if ("task" in answer) {
        // A large log: a job analyses it; AnalysisWait follows it and calls finish().
        setPhase({ kind: "queued", task: answer.task, file, name: file?.name ?? "The readings", retry: () => void send(a) });
        return;
      }
      finish(answer);
    } catch (error) {
      setPhase({ kind: "error", error, file, retry: () => void send(a) });
    }
  };

  function finish(created: CreatedTest) {
    queryClient.invalidateQueries({ queryKey: testKeys.all });
    if (context.newJob && created.test.job) {
      // The visit now exists: the next test of this visit joins it instead of making another.
      const jobId = created.test.job.id;
      setContext((c) => ({ ...c, newJob: false, newJobReason: "", jobId }));
      queryClient.invalidateQueries({ queryKey: ["jobs"] });
    }
    setPhase({ kind: "done", created });
  }

  async function onFile(file: File) {
    if (file.size > MAX_UPLOAD_BYTES) {
      setPhase({ kind: "error", error: new ApiError(413, "file_too_large", `${file.name} is ${(file.size / 1048576).toFixed(0)} MB; the limit is 64 MB.`), file, retry: reset });
      return;
    }
    if (file.size === 0) {
      setPhase({ kind: "error", error: new ApiError(422, "invalid_file", `${file.name} is empty.`), file, retry: reset });
      return;
    }
    if (isOffline()) return keepOnPhone({ source: "file", file });
    setPhase({ kind: "checking", file });
    try {
      const preview = await previewImport(await previewPart(file), file.name);
      if (preview.detected.unsure) {
        setPhase({ kind: "choose", file, preview });
        return;
      }
    } catch (error) {
      const chooser = chooserFromError(error);
      if (chooser) {
        setPhase({ kind: "choose", file, preview: chooser });
        return;
      }
      // No preview service: let the upload itself decide. Anything else is the file's problem.
      if (!(error instanceof ApiError && (error.status === 404 || error.status === 405))) {
        setPhase({ kind: "error", error, file, retry: () => void onFile(file) });
        return;
      }
    }
    await send({ source: "file", file, key: newIdempotencyKey() });
  }

  function reset() {
    setPhase({ kind: "pick" });
  }

  const busy = phase.kind === "checking" || phase.kind === "sending" || phase.kind === "queued";

  if (phase.kind === "done") return <UploadResult created={phase.created} onAnother={reset} />;

  return (
    <div className="space-y-5">
      <OfflineOutbox userId={userId} />
      <div role="tablist" aria-label="How to enter the test" className="grid grid-cols-2 gap-1 rounded-xl bg-surface-sunken p-1">
        {([
          ["file", "Gauge file"],
          ["typed", "Typed readings"],
        ] as const).map(([k, label]) => (
          <button
            key={k}
            role="tab"
            type="button"
            id={`tab-${k}`}
            aria-selected={tab === k}
            aria-controls={`panel-${k}`}
            disabled={busy}
            onClick={() => {
              setTab(k);
              if (phase.kind !== "pick") reset();
            }}
            className={`min-h-tap rounded-lg px-3 text-body font-semibold ${tab === k ? "bg-surface-raised text-fg shadow-card" : "text-fg-soft"}`}
          >
            {label}
          </button>
        ))}
      </div>

      {canCreateJob && <NewVisit value={context} onChange={setContext} technicianName={technicianName} />}

      <div role="tabpanel" id={`panel-${tab}`} aria-labelledby={`tab-${tab}`} className="space-y-4">
        {tab === "file" && phase.kind === "pick" && <DropZone onFile={onFile} />}
        {tab === "file" && phase.kind === "choose" && (
          <ColumnChooser
            preview={phase.preview}
            filename={phase.file.name}
            onConfirm={(choice) => send({ source: "file", file: phase.file, choice, key: newIdempotencyKey() })}
            onCancel={reset}
          />
        )}
        {tab === "typed" && (
          <TypedReadings busy={busy} onSubmit={(readings, mode) => send({ source: "typed", readings, mode, key: newIdempotencyKey() })} />
        )}
        {phase.kind === "queued" && (
          <AnalysisWait
            task={phase.task}
            filename={phase.name}
            onDone={finish}
            onError={(error) => setPhase({ kind: "error", error, file: phase.file, retry: phase.retry })}
          />
        )}
        {(phase.kind === "checking" || (phase.kind === "sending" && tab === "file")) && (
          <Progress label={phase.kind === "checking" ? `Checking ${phase.file.name}…` : `Sending ${phase.file?.name ?? "readings"}…`} fraction={phase.kind === "sending" ? phase.progress : null} />
        )}
        {phase.kind === "error" && (
          <ErrorPanel
            error={phase.error}
            onRetry={phase.retry}
            onReset={reset}
            tab={tab}
            onTyped={() => {
              reset();
              setTab("typed");
            }}
          />
        )}
      </div>

      <ContextFields value={context} onChange={setContext} canCreateJob={canCreateJob} />
    </div>
  );
}

function Progress({ label, fraction }: { label: string; fraction: number | null }) {
  const pct = fraction == null ? null : Math.round(fraction * 100);
  return (
    <div className="space-y-2 rounded-card border border-surface-line bg-surface-raised p-4" role="status" aria-live="polite" data-testid="upload-progress">
      <p className="text-body font-medium">{pct === 100 ? "Analysing…" : label}</p>
      <div className="h-3 overflow-hidden rounded-full bg-surface-sunken">
        <div
          className={`h-full rounded-full bg-tide-600 dark:bg-tide-400 ${pct == null ? "w-1/3 animate-pulse" : "transition-[width]"}`}
          style={pct == null ? undefined : { width: `${Math.max(4, pct)}%` }}
        />
      </div>
      {pct != null && <p className="text-caption text-fg-soft">{pct} % sent</p>}
    </div>
  );
}

function ErrorPanel({ error, onRetry, onReset, onTyped, tab }: { error: unknown; onRetry: () => void; onReset: () => void; onTyped: () => void; tab: "file" | "typed" }) {
  const a = adviseOnError(error);
  return (
    <div data-testid="upload-error">
      <Alert
        tone="error"
        title={a.title}
        action={
          <div className="flex flex-col gap-2 sm:flex-row">
            {a.canRetry && <Button onClick={onRetry}>Retry</Button>}
            {a.signIn && <LinkButton href="/sign-in">Sign in</LinkButton>}
            <Button variant="secondary" onClick={onReset}>{tab === "file" ? "Choose another file" : "Back to the readings"}</Button>
            {tab === "file" && error instanceof ApiError && error.status === 422 && (
              <Button variant="quiet" onClick={onTyped}>Type the readings instead</Button>
            )}
          </div>
        }
      >
        <p data-testid="upload-error-message">{a.message}</p>
        <p className="mt-1 text-fg-soft">{a.todo}</p>
      </Alert>
    </div>
  );
}
