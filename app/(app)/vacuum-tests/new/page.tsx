import type { Metadata } from "next";
import { can } from "@/lib/permissions";
import { pageActor } from "@/lib/session";
import { NewTest } from "./NewTest";

export const metadata: Metadata = { title: "New test" };

/** New test: upload the gauge's CSV or type the readings; the verdict shows here. */
export default async function NewTestPage() {
  const actor = await pageActor("tests.upload");
  return (
    <div className="mx-auto w-full max-w-3xl space-y-4 px-4 py-5 sm:py-8">
      <div>
        <h1 className="text-headline">New test</h1>
        <p className="text-body text-fg-soft">Send the micron gauge’s log, or type the readings. The verdict shows here in seconds.</p>
      </div>
      <NewTest technicianName={actor.name} canCreateJob={can(actor.role, "records.manage")} userId={actor.userId} />
    </div>
  );
}
