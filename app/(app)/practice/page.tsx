import type { Metadata } from "next";
import Link from "next/link";
import { db } from "@/db/client";
import { Badge, Card, EmptyState } from "@/components/ui";
import { VerdictBadge } from "@/components/verdict/VerdictBadge";
import type { Verdict } from "@/analysis/decay/types";
import { canReadAllTests } from "@/lib/permissions";
import { listPracticeCalls, listPracticeTests } from "@/lib/practice/view";
import { PRACTICE_CALL_WORDS, type CallChoice } from "@/lib/practice/words";
import { pageActor } from "@/lib/session";
import { CommentForm } from "./CommentForm";

export const metadata: Metadata = { title: "Practice calls" };
export const dynamic = "force-dynamic";

const pct = (x: number) => `${Math.round(x * 100)} %`;

/** Apprentices: their practice tests and calls. Trainers, leads, owners: every apprentice's calls and match rate. */
export default async function PracticePage() {
  const actor = await pageActor();
  const seesAll = canReadAllTests(actor.role);
  const [tests, overview] = await Promise.all([actor.role === "apprentice" ? listPracticeTests(db(), actor) : Promise.resolve([]), listPracticeCalls(db(), actor, {})]);
  return (
    <div className="mx-auto w-full max-w-5xl space-y-5 px-4 py-5 sm:py-8">
      <header className="space-y-1">
        <h1 className="text-headline">Practice calls</h1>
        <p className="text-body text-fg-soft">
          {actor.role === "apprentice"
            ? "Mark a test as practice when you upload it. Make your own call on the curve first; then see what the analysis says."
            : "Each apprentice's own calls on their practice tests, beside the analysis, and how often they matched."}
        </p>
      </header>

      {actor.role === "apprentice" && (
        <Card title="Your practice tests" flush>
          {tests.length === 0 ? (
            <div className="p-4"><EmptyState title="No practice tests yet">Tick “Practice” on the new-test form to add one.</EmptyState></div>
          ) : (
            <ul className="divide-y divide-surface-line" data-testid="practice-tests">
              {tests.map((t) => (
                <li key={t.id}>
                  <Link href={`/practice/${t.id}`} className="flex min-h-tap flex-wrap items-center justify-between gap-2 px-4 py-3 hover:bg-surface-sunken">
                    <span className="font-medium">{t.title}</span>
                    {t.called ? <Badge tone={t.matched ? "pass" : "unsure"}>{t.matched ? "Matched" : "Didn't match"}</Badge> : <Badge tone="attention">Make your call</Badge>}
                  </Link>
                </li>
              ))}
            </ul>
          )}
        </Card>
      )}

      {seesAll && (
        <Card title="Apprentices" flush>
          {overview.apprentices.length === 0 ? (
            <p className="px-4 pb-4 text-body text-fg-soft">No practice calls yet.</p>
          ) : (
            <table className="w-full text-left text-body" data-testid="apprentice-scores">
              <thead className="text-caption text-fg-soft">
                <tr><th scope="col" className="px-4 py-2">Apprentice</th><th scope="col" className="px-2 py-2 text-right">Calls</th><th scope="col" className="px-2 py-2 text-right">Matched</th><th scope="col" className="px-4 py-2 text-right">Match rate</th></tr>
              </thead>
              <tbody>
                {overview.apprentices.map((a) => (
                  <tr key={a.apprentice.id} className="border-t border-surface-line">
                    <th scope="row" className="px-4 py-2 font-medium">{a.apprentice.name}</th>
                    <td className="px-2 py-2 text-right tabular-nums">{a.calls}</td>
                    <td className="px-2 py-2 text-right tabular-nums">{a.matched}</td>
                    <td className="px-4 py-2 text-right tabular-nums">{pct(a.matchRate)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          )}
        </Card>
      )}

      {overview.calls.length > 0 && (
        <section className="space-y-3" aria-label="Calls">
          <h2 className="text-title">{seesAll ? "Calls" : "Your calls"}</h2>
          {overview.calls.map((c) => (
            <Card key={c.id} data-testid="practice-call">
              <div className="space-y-2">
                <p className="flex flex-wrap items-center gap-2">
                  <span className="font-semibold">{c.testTitle}</span>
                  <span className="text-caption text-fg-soft">{seesAll ? `${c.apprentice.name} · ` : ""}{new Date(c.createdAt).toLocaleDateString("en-US", { dateStyle: "medium" })}</span>
                </p>
                <p className="flex flex-wrap items-center gap-2 text-body">
                  <span>Call: <strong>{PRACTICE_CALL_WORDS[c.call as CallChoice] ?? c.call}</strong></span>
                  <span aria-hidden>·</span>
                  <span className="flex items-center gap-1">Analysis: <VerdictBadge verdict={c.analysisVerdict as Verdict} /></span>
                  <Badge tone={c.matched ? "pass" : "unsure"}>{c.matched ? "Matched" : "Didn't match"}</Badge>
                </p>
                <p className="text-body text-fg-soft">“{c.reason}”</p>
                {c.comments.length > 0 && (
                  <ul className="space-y-1 border-l-4 border-tide-600 pl-3 text-body">
                    {c.comments.map((m) => <li key={m.id}><span className="font-medium">{m.author.name}:</span> {m.body}</li>)}
                  </ul>
                )}
                <CommentForm callId={c.id} />
              </div>
            </Card>
          ))}
        </section>
      )}
    </div>
  );
}
