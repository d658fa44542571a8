import type { Metadata } from "next";
import { pageActor } from "@/lib/session";
import { WaterCalculator } from "./WaterCalculator";

export const metadata: Metadata = { title: "Vacuum and water" };

export default async function WaterPage() {
  await pageActor();
  return (
    <div className="mx-auto w-full max-w-3xl space-y-4 px-4 py-5 sm:py-8">
      <div>
        <h1 className="text-headline">Vacuum and water</h1>
        <p className="text-body text-fg-soft">Water boils at a lower temperature the deeper the vacuum; below about 4,600 microns it can freeze instead.</p>
      </div>
      <WaterCalculator />
    </div>
  );
}
