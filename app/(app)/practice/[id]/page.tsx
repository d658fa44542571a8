import type { Metadata } from "next";
import { pageActor } from "@/lib/session";
import { PracticeCallView } from "./PracticeCallView";

export const metadata: Metadata = { title: "Practice call" };

export default async function PracticeTestPage({ params }: { params: Promise<{ id: string }> }) {
  const actor = await pageActor();
  const { id } = await params;
  return (
    <div className="mx-auto w-full max-w-5xl px-4 py-5 sm:py-8">
      <PracticeCallView id={id} canCall={actor.role === "apprentice"} />
    </div>
  );
}
