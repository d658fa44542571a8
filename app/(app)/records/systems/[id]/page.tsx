import type { Metadata } from "next";
import { chargeWords, lengthWords } from "@/lib/units/format";
import { chargeWords as chargeWithKg } from "@/lib/words/charge";
import { unitSettingsOf } from "@/lib/units/settings";
import { codeWords } from "@/lib/words/codes";
import Link from "next/link";
import { notFound } from "next/navigation";
import type { Verdict } from "@/analysis/decay/types";
import { db } from "@/db/client";
import { Card, LinkButton } from "@/components/ui";
import { VerdictBadge } from "@/components/verdict/VerdictBadge";
import { systemHistoryOf } from "@/lib/reports/history";
import { pageActor } from "@/lib/session";
import { OverlayCurves } from "./OverlayCurves";

export const metadata: Metadata = { title: "System" };
export const dynamic = "force-dynamic";
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
const day = (iso: string) => new Date(iso).toLocaleString("en-US", { dateStyle: "medium", timeStyle: "short" });

/** One system: what it is, and every test ever run on it, newest first, with the curves overlaid. */
export default async function SystemPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const actor = await pageActor();
  if (!UUID.test(id)) notFound();
  const h = await systemHistoryOf(db(), { viewer: { organizationId: actor.organizationId, userId: actor.userId, role: actor.role }, systemId: id });
  if (!h) notFound();
  const s = h.system;
  const { effective: units } = await unitSettingsOf(db(), actor);
  const facts: [string, string | null][] = [
    ["Kind", codeWords(s.kind)],
    ["Refrigerant", s.refrigerant],
    ["Factory charge", s.factoryChargeKg != null ? (units === "metric" ? chargeWords(s.factoryChargeKg, units) : chargeWithKg(s.factoryChargeKg)) : null],
    ["Line set", s.lineSetFeet != null ? `${lengthWords(s.lineSetFeet, units)}${s.liquidOd ? `, ${s.liquidOd} in. liquid` : ""}${s.suctionOd ? ` / ${s.suctionOd} in. suction` : ""}` : null],
    ["Indoor coil", s.indoorCoilLitres != null ? `${s.indoorCoilLitres} L` : null],
    ["Outdoor unit", s.outdoorUnitLitres != null ? `${s.outdoorUnitLitres} L` : null],
    ["Installed", s.installedOn],
  ];
  return (
    <div className="mx-auto w-full max-w-3xl space-y-5 px-4 py-5 sm:py-8">
      {h.site && <LinkButton href={`/records/sites/${h.site.id}`} variant="quiet">← {h.site.name}</LinkButton>}
      <div>
        <h1 className="text-headline">{s.name}</h1>
        {h.site && <p className="text-body text-fg-soft">{[h.site.name, h.site.address].filter(Boolean).join(" · ")}</p>}
      </div>
      <Card title="The system">
        <dl className="grid grid-cols-[9rem_1fr] gap-1 text-body">
          {facts.filter(([, v]) => v).map(([k, v]) => (
            <div key={k} className="contents">
              <dt className="text-fg-soft">{k}</dt>
              <dd>{v}</dd>
            </div>
          ))}
        </dl>
      </Card>
      <Card title={`Tests on this system (${h.tests.length})`}>
        <OverlayCurves curves={h.tests.map((t) => ({ id: t.id, label: `${t.title}, ${day(t.testedAt)}`, curve: t.curve }))} />
        <ol className="mt-4 divide-y divide-surface-line" data-testid="system-tests">
          {h.tests.map((t) => (
            <li key={t.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
              <div>
                <Link href={`/vacuum-tests/${t.id}`} className="font-medium text-tide-700 underline dark:text-tide-200">{t.title}</Link>
                <p className="text-caption text-fg-soft">{day(t.testedAt)} · {t.technicianName}{t.isPractice ? " · practice" : ""}</p>
              </div>
              {t.practiceCallUrl ? (
                <Link href={t.practiceCallUrl} className="text-caption font-medium text-tide-700 underline dark:text-tide-200">Make your call</Link>
              ) : (
                <VerdictBadge verdict={t.verdict as Verdict | null} meetsProfile={t.meetsProfile} />
              )}
            </li>
          ))}
        </ol>
      </Card>
    </div>
  );
}
