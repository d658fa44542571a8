"use client";

import { AuthFrame } from "@/components/shell/AuthFrame";
import { Button } from "@/components/ui";

/**
 * A page that could not be rendered: in plain words, with a retry. The reason stays in the server
 * log (a store that does not answer is the usual one); the browser sees only this.
 */
export default function PageError({ reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <AuthFrame title="This page could not load">
      <p className="text-body text-fg-soft">
        Riseline could not finish this page just now; nothing you saved is lost. If the database or the file store was not answering, it usually is again within a minute.
      </p>
      <div className="mt-4">
        <Button onClick={() => reset()}>Try again</Button>
      </div>
    </AuthFrame>
  );
}
