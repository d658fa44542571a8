import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { db } from "@/db/client";
import { AppError } from "@/lib/errors";
import { rigDetail, todayIso, viewerOf } from "@/lib/rigs/service";
import { pageActor } from "@/lib/session";
import { RigDetail, type RigDetailData } from "./RigDetail";

export const metadata: Metadata = { title: "Rig" };

export default async function RigPage({ params }: { params: Promise<{ id: string }> }) {
  const actor = await pageActor();
  const { id } = await params;
  if (!/^[0-9a-f-]{36}$/i.test(id)) notFound();
  let detail;
  try {
    detail = await rigDetail(db(), viewerOf(actor), id, todayIso());
  } catch (e) {
    if (e instanceof AppError && e.code === "not_found") notFound();
    throw e;
  }
  return (
    <div className="mx-auto w-full max-w-3xl space-y-4 px-4 py-5 sm:py-8">
      <RigDetail data={JSON.parse(JSON.stringify(detail)) as RigDetailData} today={todayIso()} />
    </div>
  );
}
