"use client";

/**
 * "Use a rig": fills the planner's pump and hose fields from a rig in the register (its pump's
 * free-air displacement, its latest blank-off or else the maker's rating, its hoses).
 */
import { useEffect, useState } from "react";
import { Select } from "@/components/ui";
import { apiFetch } from "@/lib/client/api";

export interface RigSetup {
  displacementCfm: number | null;
  blankOffMicrons: number | null;
  hoseCount: number | null;
  hoseInsideDiameterIn: number | null;
  hoseLengthFt: number | null;
}

interface Detail {
  items: { id: string; kind: string; freeAirCfm: number | null; blankOffRatingMicrons: number | null; insideDiameterIn: number | null; lengthFt: number | null }[];
  blankOffTrend: { itemId: string | null; lowestMicrons: number }[];
}

export function setupOfRig(d: Detail): RigSetup {
  const pump = d.items.find((i) => i.kind === "pump");
  const hoses = d.items.filter((i) => i.kind === "hose" && i.insideDiameterIn && i.lengthFt);
  const blankOffs = d.blankOffTrend.filter((b) => !pump || b.itemId === pump.id || b.itemId === null);
  return {
    displacementCfm: pump?.freeAirCfm ?? null,
    blankOffMicrons: blankOffs.length ? blankOffs[blankOffs.length - 1].lowestMicrons : pump?.blankOffRatingMicrons ?? null,
    hoseCount: hoses.length || null,
    hoseInsideDiameterIn: hoses[0]?.insideDiameterIn ?? null,
    hoseLengthFt: hoses[0]?.lengthFt ?? null,
  };
}

export function RigPicker({ onPick }: { onPick: (setup: RigSetup) => void }) {
  const [rigs, setRigs] = useState<{ id: string; name: string }[]>([]);
  const [choice, setChoice] = useState("");
  useEffect(() => {
    let live = true;
    apiFetch<{ rigs: { id: string; name: string }[] }>("/api/rigs").then(
      (r) => live && setRigs(r.rigs),
      () => undefined,
    );
    return () => {
      live = false;
    };
  }, []);
  if (rigs.length === 0) return null;
  return (
    <Select
      label="Use a rig from the register"
      value={choice}
      onChange={async (e) => {
        setChoice(e.target.value);
        if (!e.target.value) return;
        const detail = await apiFetch<Detail>(`/api/rigs/${e.target.value}`);
        onPick(setupOfRig(detail));
      }}
      options={[{ value: "", label: "Type the pump and hoses" }, ...rigs.map((r) => ({ value: r.id, label: r.name }))]}
    />
  );
}
