import type { Metadata } from "next";
import { db } from "@/db/client";
import { listSystemsForPlannerByOrganization } from "@/db/queries/planner-history";
import { pageActor } from "@/lib/session";
import { Planner } from "./Planner";

export const metadata: Metadata = { title: "Pull-down planner" };

export default async function PlannerPage() {
  const actor = await pageActor();
  const systems = await listSystemsForPlannerByOrganization(db(), { organizationId: actor.organizationId });
  return (
    <div className="mx-auto w-full max-w-3xl space-y-4 px-4 py-5 sm:py-8">
      <div>
        <h1 className="text-headline">Pull-down planner</h1>
        <p className="text-body text-fg-soft">The system, its condition, the pump and the hoses: how long to the target as a range, and what would make it faster.</p>
      </div>
      <Planner systems={systems.map((s) => ({ ...s, label: `${s.siteName} · ${s.name}` }))} />
    </div>
  );
}
