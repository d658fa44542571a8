import type { Metadata } from "next";
import { AuthFrame, TextLink } from "@/components/shell/AuthFrame";

export const metadata: Metadata = { title: "Not found" };

/** Any address Riseline does not know, in our own words (and under the page CSP: no inline styles). */
export default function NotFound() {
  return (
    <AuthFrame title="Not found">
      <p className="text-body text-fg-soft">There is nothing at this address. It may have been moved or removed, or the link was cut short.</p>
      <p className="mt-4">
        <TextLink href="/home">Go to Riseline</TextLink>
      </p>
    </AuthFrame>
  );
}
