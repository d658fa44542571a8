"use client";

/**
 * What water does at a vacuum: the temperature at which it boils (above the triple point,
 * about 4,588 microns) or at which ice is in equilibrium (below it). Small enough to sit beside
 * the freeze-risk finding: <WaterAtVacuum microns={500} />.
 * Physics in analysis/calculators/water.ts (PsychroLib, ASHRAE Hyland–Wexler).
 */
import { iceEquilibriumC } from "@/analysis/calculators/water";
import { PA_PER_MICRON } from "@/analysis/shared/units";

/** Triple point of water, 611.657 Pa (IAPWS), in microns. */
export const TRIPLE_POINT_MICRONS = 611.657 / PA_PER_MICRON;

export function cToF(c: number): number {
  return (c * 9) / 5 + 32;
}

export function WaterAtVacuum({ microns, className = "" }: { microns: number; className?: string }) {
  const c = iceEquilibriumC(microns);
  if (!Number.isFinite(c)) return <p className={className}>Outside the range of the water tables (−148 to 392 °F, −100 to 200 °C).</p>;
  const ice = microns < TRIPLE_POINT_MICRONS;
  return (
    <p className={`text-body ${className}`} data-testid="water-at-vacuum">
      At <strong>{Math.round(microns).toLocaleString("en-US")} microns</strong> ({(microns * PA_PER_MICRON).toFixed(1)} Pa){" "}
      {ice ? "ice is in equilibrium at " : "water boils at "}
      <strong>
        {cToF(c).toFixed(1)} °F ({c.toFixed(1)} °C)
      </strong>
      {ice ? ": water left in the system boils, cools itself and can freeze; ice then goes off only slowly." : "."}
    </p>
  );
}
