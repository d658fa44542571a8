import type { Metadata } from "next";
import { can } from "@/lib/permissions";
import { pageActor } from "@/lib/session";
import { TestView } from "./TestView";

export const metadata: Metadata = { title: "Test" };

export default async function TestPage({ params }: { params: Promise<{ id: string }> }) {
  const actor = await pageActor();
  const { id } = await params;
  return (
    <div className="mx-auto w-full max-w-5xl px-4 py-5 sm:py-8">
      <TestView id={id} canReanalyse={can(actor.role, "tests.reanalyse")} canShare={can(actor.role, "reports.share")} canCurate={can(actor.role, "casebook.curate")} userId={actor.userId} />
    </div>
  );
}
