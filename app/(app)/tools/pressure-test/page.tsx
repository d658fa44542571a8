import type { Metadata } from "next";
import { db } from "@/db/client";
import { listPressureTestsByViewer } from "@/db/queries/pressure-tests";
import { listJobsByOrganization } from "@/db/queries/records";
import { Badge, Card } from "@/components/ui";
import { pageActor } from "@/lib/session";
import { PressureTestForm } from "./PressureTestForm";
import { durationWords } from "@/analysis/shared/format";
import { UNIT_WORDS, VERDICT_TONE, VERDICT_WORDS } from "./words";

export const metadata: Metadata = { title: "Nitrogen pressure test" };

/** Record a nitrogen standing-pressure test; recent ones below. */
export default async function PressureTestPage() {
  const actor = await pageActor();
  const viewer = { organizationId: actor.organizationId, userId: actor.userId, role: actor.role };
  const [recent, jobs] = await Promise.all([
    listPressureTestsByViewer(db(), { viewer, limit: 20 }),
    listJobsByOrganization(db(), { organizationId: actor.organizationId }),
  ]);
  return (
    <div className="mx-auto w-full max-w-3xl space-y-4 px-4 py-5 sm:py-8">
      <div>
        <h1 className="text-headline">Nitrogen pressure test</h1>
        <p className="text-body text-fg-soft">Pressure follows temperature. Riseline works out what the end reading should be with no leak.</p>
      </div>
      <PressureTestForm jobs={jobs.slice(0, 50).map((j) => ({ id: j.id, label: [j.visitedOn, j.reference, j.reason].filter(Boolean).join(" · ") }))} />
      <Card title="Recent pressure tests" flush>
        {recent.length === 0 ? (
          <p className="px-4 pb-4 text-body text-fg-soft">None yet.</p>
        ) : (
          <ul className="divide-y divide-surface-line" data-testid="recent-pressure-tests">
            {recent.map((t) => (
              <li key={t.id} className="flex flex-wrap items-center justify-between gap-2 px-4 py-3">
                <span>
                  <span className="block font-medium">{t.title}</span>
                  <span className="text-caption text-fg-soft">
                    {(t.startedAt ?? t.testedAt).toISOString().slice(0, 16).replace("T", " ")} UTC
                    {t.durationSeconds ? ` · ${durationWords(t.durationSeconds)}` : ""} · {t.createdByName} · {t.startPressure} → {t.endPressure} {UNIT_WORDS[t.unit]}
                    {t.verdict === "stopped" && t.highestPressure !== null ? ` · highest ${t.highestPressure} ${UNIT_WORDS[t.unit]}, acknowledged` : ""}
                  </span>
                </span>
                <Badge tone={VERDICT_TONE[t.verdict]} className="whitespace-normal">{VERDICT_WORDS[t.verdict]}</Badge>
              </li>
            ))}
          </ul>
        )}
      </Card>
    </div>
  );
}
