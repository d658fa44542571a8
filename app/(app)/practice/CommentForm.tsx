"use client";

import { useState } from "react";
import { useRouter } from "next/navigation";
import { Alert, Button, Input } from "@/components/ui";
import { sendJson } from "../casebook/send";

export function CommentForm({ callId }: { callId: string }) {
  const router = useRouter();
  const [body, setBody] = useState("");
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  return (
    <form
      className="flex flex-wrap items-end gap-2"
      onSubmit={async (e) => {
        e.preventDefault();
        setBusy(true);
        setError(null);
        try {
          await sendJson("POST", `/api/practice/calls/${callId}/comments`, { body });
          setBody("");
          router.refresh();
        } catch (err) {
          setError((err as Error).message);
        } finally {
          setBusy(false);
        }
      }}
    >
      <Input label="Comment" className="min-w-0 flex-1" value={body} onChange={(e) => setBody(e.target.value)} maxLength={2000} required />
      <Button type="submit" variant="secondary" busy={busy}>Comment</Button>
      {error && <Alert tone="error" className="w-full">{error}</Alert>}
    </form>
  );
}
