"use client";

import { useState } from "react";
import { Alert, Button } from "@/components/ui";

/** The one-click POST (RFC 8058 §3.1 body); without script the form posts the same body itself. */
export function UnsubscribeButton({ action, label }: { action: string; label: string }) {
  const [state, setState] = useState<"idle" | "busy" | "done" | "error">("idle");
  if (state === "done") return <Alert tone="success">Unsubscribed: you will no longer receive “{label}” mail from this shop.</Alert>;
  return (
    <form
      method="post"
      action={action}
      className="mt-4"
      onSubmit={async (e) => {
        e.preventDefault();
        setState("busy");
        const res = await fetch(action, { method: "POST", headers: { "content-type": "application/x-www-form-urlencoded" }, body: "List-Unsubscribe=One-Click" }).catch(() => null);
        setState(res?.ok ? "done" : "error");
      }}
    >
      <input type="hidden" name="List-Unsubscribe" value="One-Click" />
      <Button type="submit" busy={state === "busy"}>Stop this mail</Button>
      {state === "error" && <Alert tone="error">Riseline could not record it. Check the connection and press the button again.</Alert>}
    </form>
  );
}
