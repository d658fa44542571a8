"use client";

import { useState } from "react";
import { Alert, Button } from "@/components/ui";
import { getRawLink, type VacuumTestDetail } from "@/lib/client/api";

function sizeWords(bytes: number): string {
  if (bytes < 1024) return `${bytes}\u00a0B`;
  if (bytes < 1048576) return `${(bytes / 1024).toFixed(0)}\u00a0kB`;
  return `${(bytes / 1048576).toFixed(1)}\u00a0MB`;
}

/** The file exactly as uploaded, through a short-lived link. */
export function RawDownload({ testId, upload }: { testId: string; upload: VacuumTestDetail["upload"] }) {
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  if (!upload) return <p className="text-body text-fg-soft">Typed readings: there is no file to download.</p>;
  return (
    <div className="space-y-2">
      <Button
        variant="secondary"
        block
        busy={busy}
        onClick={async () => {
          setBusy(true);
          setError(null);
          try {
            const { url } = await getRawLink(testId);
            window.location.assign(url);
          } catch (e) {
            setError((e as Error).message);
          } finally {
            setBusy(false);
          }
        }}
      >
        Download the raw file
      </Button>
      <p className="break-words text-caption text-fg-soft">
        {upload.filename} · {sizeWords(upload.sizeBytes)} · SHA-256 {upload.sha256.slice(0, 12)}…
      </p>
      {error && <Alert tone="error">{error}</Alert>}
    </div>
  );
}
