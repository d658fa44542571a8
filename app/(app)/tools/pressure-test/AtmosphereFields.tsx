"use client";

/**
 * Where the atmosphere comes from: the standard sea-level one, the standard atmosphere at the
 * site's elevation (ISO 2533), or a barometer reading — always labelled in the test's absolute unit.
 */
import { ATMOSPHERE_UNIT_LABEL, atmosphereAtElevation, PLAUSIBLE_ATMOSPHERE, type AtmosphereUnit } from "@/analysis/calculators/atmosphere";
import { Input, Select } from "@/components/ui";

export type AtmosphereMode = "standard" | "elevation" | "entered";

export interface AtmosphereState {
  mode: AtmosphereMode;
  value: string;
  elevation: string;
  elevationUnit: "m" | "ft";
}

const STANDARD: Record<AtmosphereUnit, number> = { psia: 14.696, kpa: 101.325, bar: 1.01325 };

function num(s: string): number {
  return s.trim() === "" ? NaN : Number(s.replace(",", "."));
}

/** The request fields for the chosen atmosphere (nothing for the standard one). */
export function atmosphereBody(a: AtmosphereState): { atmosphereAbs?: number; siteElevation?: { value: number; unit: "m" | "ft" } } {
  if (a.mode === "entered" && Number.isFinite(num(a.value))) return { atmosphereAbs: num(a.value) };
  if (a.mode === "elevation" && Number.isFinite(num(a.elevation))) return { siteElevation: { value: num(a.elevation), unit: a.elevationUnit } };
  return {};
}

export function AtmosphereFields({ state, onChange, unit }: { state: AtmosphereState; onChange: (s: AtmosphereState) => void; unit: AtmosphereUnit | null }) {
  const label = unit ? ATMOSPHERE_UNIT_LABEL[unit] : "the log's absolute unit";
  let computed: string | null = null;
  if (state.mode === "elevation" && unit && Number.isFinite(num(state.elevation))) {
    try {
      computed = `${atmosphereAtElevation(num(state.elevation), state.elevationUnit, unit).toFixed(unit === "bar" ? 4 : 2)} ${label} (ISO 2533 standard atmosphere)`;
    } catch (e) {
      computed = (e as Error).message;
    }
  }
  const range = unit ? PLAUSIBLE_ATMOSPHERE[unit] : null;
  return (
    <>
      <Select
        label="Atmosphere"
        value={state.mode}
        onChange={(e) => onChange({ ...state, mode: e.target.value as AtmosphereMode })}
        options={[
          { value: "standard", label: unit ? `Standard, sea level (${STANDARD[unit]} ${label})` : "Standard, sea level" },
          { value: "elevation", label: "From the site's elevation" },
          { value: "entered", label: "Barometer reading" },
        ]}
        hint="Gauge readings are relative to the air around the gauge; at altitude it is lower."
      />
      {state.mode === "elevation" && (
        <div className="flex gap-2">
          <Input
            className="flex-1"
            label="Site elevation"
            inputMode="decimal"
            value={state.elevation}
            onChange={(e) => onChange({ ...state, elevation: e.target.value })}
            hint={computed ?? "Above sea level"}
          />
          <Select
            label="Unit"
            value={state.elevationUnit}
            onChange={(e) => onChange({ ...state, elevationUnit: e.target.value as "m" | "ft" })}
            options={[
              { value: "ft", label: "ft" },
              { value: "m", label: "m" },
            ]}
          />
        </div>
      )}
      {state.mode === "entered" && (
        <Input
          label={`Atmosphere (${label})`}
          inputMode="decimal"
          value={state.value}
          onChange={(e) => onChange({ ...state, value: e.target.value })}
          hint={range ? `Station pressure, not corrected to sea level: ${range.min}–${range.max} ${label}` : "Station pressure, not corrected to sea level"}
        />
      )}
    </>
  );
}
