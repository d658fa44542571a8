import Link from "next/link";
import { Card } from "@/components/ui";
import type { SentBackRequest } from "@/db/queries/home";

/** The first thing a technician sees when a lead sent a test back: the test and the lead's own words. */
export function SentBackCard({ requests, timeZone }: { requests: SentBackRequest[]; timeZone: string }) {
  if (requests.length === 0) return null;
  return (
    <Card title={`Sent back to you (${requests.length})`} data-testid="home-sent-back">
      <ul className="space-y-3">
        {requests.map((r) => (
          <li key={r.testId} className="rounded-card border-2 border-flare-500 p-3">
            <Link href={`/vacuum-tests/${r.testId}`} className="text-lead font-semibold text-tide-700 underline dark:text-tide-300">
              {r.title}
            </Link>
            {r.siteName && <p className="text-caption text-fg-soft">{r.siteName}</p>}
            <p className="mt-1 text-body" data-testid="home-sent-back-request">
              <span className="font-medium">{r.by ?? "A lead"} asks: </span>
              {r.request ?? "see the test"}
            </p>
            <p className="text-caption text-fg-faint">{r.at.toLocaleString("en-US", { dateStyle: "medium", timeStyle: "short", timeZone })}</p>
          </li>
        ))}
      </ul>
    </Card>
  );
}
