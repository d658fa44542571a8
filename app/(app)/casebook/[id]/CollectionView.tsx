"use client";

import { useState } from "react";
import { Button, Card, EmptyState, LinkButton } from "@/components/ui";
import type { CasebookEntryDto } from "@/lib/casebook/dto";
import { OVERLAY_MAX_TESTS } from "@/lib/casebook/limits";
import { AddEntryForm, type RecentTest } from "./AddEntryForm";
import { EntryCard } from "./EntryCard";

/** The collection's entries with their curves and pins; pick up to eight to compare. */
export function CollectionView({ collectionId, entries, curate, recentTests }: { collectionId: string; entries: CasebookEntryDto[]; curate: boolean; recentTests: RecentTest[] }) {
  const [picked, setPicked] = useState<string[]>([]);
  const toggle = (testId: string) => setPicked((p) => (p.includes(testId) ? p.filter((x) => x !== testId) : p.length >= OVERLAY_MAX_TESTS ? p : [...p, testId]));
  return (
    <div className="space-y-5">
      <div className="sticky top-0 z-10 flex flex-wrap items-center gap-3 rounded-xl bg-surface/95 py-2 backdrop-blur">
        <LinkButton
          href={`/compare?tests=${picked.join(",")}`}
          variant={picked.length ? "primary" : "secondary"}
          aria-disabled={picked.length < 1 || undefined}
          onClick={(e) => picked.length < 1 && e.preventDefault()}
          data-testid="compare-link"
        >
          Compare {picked.length ? `${picked.length} curve${picked.length === 1 ? "" : "s"}` : "curves"}
        </LinkButton>
        <span className="text-caption text-fg-soft">Tick up to {OVERLAY_MAX_TESTS} curves to overlay them.</span>
        {picked.length > 0 && <Button variant="quiet" onClick={() => setPicked([])}>Clear</Button>}
      </div>
      {entries.length === 0 ? (
        <EmptyState title="No curves in this collection yet">{curate ? "Add a test below." : "Your trainer has not added any curves yet."}</EmptyState>
      ) : (
        <ol className="space-y-5" aria-label="Curves">
          {entries.map((e, i) => (
            <li key={e.id}>
              <EntryCard index={i + 1} entry={e} curate={curate} collectionId={collectionId} picked={picked.includes(e.testId)} onTogglePick={() => toggle(e.testId)} />
            </li>
          ))}
        </ol>
      )}
      {curate && (
        <Card title="Add a test to this collection">
          <AddEntryForm collectionId={collectionId} recentTests={recentTests} />
        </Card>
      )}
    </div>
  );
}
