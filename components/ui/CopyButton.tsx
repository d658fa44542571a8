"use client";

import { useState } from "react";
import { Button } from "./Button";

/**
 * Copies a text to the clipboard (the async Clipboard API; on a page where it is refused, the old
 * select-and-copy command) and says so. When both are refused it says to copy by hand.
 */
export function CopyButton({ text, label = "Copy" }: { text: string; label?: string }) {
  const [state, setState] = useState<"idle" | "copied" | "failed">("idle");
  const copy = async () => {
    try {
      await navigator.clipboard.writeText(text);
      setState("copied");
      return;
    } catch {
      // fall through to the old command
    }
    const area = document.createElement("textarea");
    area.value = text;
    area.setAttribute("readonly", "");
    area.style.position = "fixed";
    area.style.opacity = "0";
    document.body.appendChild(area);
    area.select();
    const ok = document.execCommand("copy");
    area.remove();
    setState(ok ? "copied" : "failed");
  };
  return (
    <span className="inline-flex items-center gap-2">
      <Button variant="secondary" onClick={() => void copy()}>{label}</Button>
      <span role="status" className="text-caption text-fg-soft">
        {state === "copied" ? "Copied" : state === "failed" ? "Copy did not work here: select the link and copy it by hand." : ""}
      </span>
    </span>
  );
}
