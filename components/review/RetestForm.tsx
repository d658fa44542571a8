"use client";

import { useState } from "react";
import { useMutation } from "@tanstack/react-query";
import { Alert, Button, Input, Textarea } from "@/components/ui";
import { newIdempotencyKey } from "@/lib/client/api";
import { verdictText } from "@/components/verdict/words";
import type { Verdict } from "@/analysis/decay/types";
import { postRetest, type RetestResult } from "./api";

export interface RetestFormProps {
  testId: string;
  onDone: (result: RetestResult) => void;
  onCancel: () => void;
}

/**
 * The re-test of a sent-back test: the new gauge log (and what was done), analysed and stored on
 * the same test, which goes back to the lead. One key per chosen file, so a retry never doubles it.
 */
export function RetestForm({ testId, onDone, onCancel }: RetestFormProps) {
  const [file, setFile] = useState<{ file: File; key: string } | null>(null);
  const [note, setNote] = useState("");
  const m = useMutation({
    mutationFn: (f: { file: File; key: string }) => postRetest(testId, f.file, note, f.key),
    onSuccess: onDone,
  });
  return (
    <form
      className="space-y-3"
      data-testid="retest-form"
      onSubmit={(e) => {
        e.preventDefault();
        if (file) m.mutate(file);
      }}
    >
      <Input
        label="Re-test log file (CSV)"
        type="file"
        accept=".csv,.txt,.tsv,.log,text/csv,text/plain"
        required
        onChange={(e) => {
          const f = e.target.files?.[0];
          m.reset();
          setFile(f ? { file: f, key: newIdempotencyKey() } : null);
        }}
        hint="The gauge's log of the new pull-down and hold. The first log stays on record."
      />
      <Textarea label="What did you do? (optional)" value={note} onChange={(e) => setNote(e.target.value)} rows={3} maxLength={2000} />
      <div className="flex flex-wrap gap-2">
        <Button type="submit" busy={m.isPending} disabled={!file}>
          Send the re-test
        </Button>
        <Button variant="quiet" onClick={onCancel} disabled={m.isPending}>
          Cancel
        </Button>
      </div>
      {m.isError && (
        <Alert tone="error" title="The re-test was not saved">
          <span data-testid="retest-error">{(m.error as Error).message}</span> The test is unchanged.
        </Alert>
      )}
    </form>
  );
}

/** "Re-test analysed (version 2): Tight and dry." */
export function retestWords(r: RetestResult): string {
  return `Re-test analysed (version ${r.version}): ${verdictText(r.analysis.verdict as Verdict).headline}. Back with the lead for review.`;
}
