/**
 * Quantities in words, in one unit system: temperatures (stored °C), lengths (stored feet),
 * charges (stored kg) and gauge pressures (stored psig). Microns stay microns in both systems
 * (the trade's unit of deep vacuum), so there is no formatter for them here.
 */
import {
  celsiusFromFahrenheit,
  feetFromMetres,
  fahrenheitFromCelsius,
  kgFromPounds,
  kpaFromPsi,
  metresFromFeet,
  poundsFromKg,
  psiFromKpa,
  type UnitSystem,
} from "./convert";

const round = (v: number, digits: number): number => Number(v.toFixed(digits));

/** Unit symbols of each system, for labels ("Line-set length (m)"). */
export const UNIT_SYMBOLS = {
  imperial: { temperature: "°F", length: "ft", charge: "lb", pressure: "psig" },
  metric: { temperature: "°C", length: "m", charge: "kg", pressure: "kPa" },
} as const;

/** 21.5 °C → "71 °F" (imperial, whole degrees) or "21.5 °C" (metric, one decimal). */
export function temperatureWords(celsius: number, system: UnitSystem): string {
  return system === "metric" ? `${round(celsius, 1)} °C` : `${Math.round(fahrenheitFromCelsius(celsius))} °F`;
}

/** 25 ft → "25 ft" or "7.6 m" (one decimal: a line set is measured to the tenth of a metre). */
export function lengthWords(feet: number, system: UnitSystem): string {
  return system === "metric" ? `${round(metresFromFeet(feet), 1)} m` : `${round(feet, 1)} ft`;
}

/** 1.5 kg → "3 lb 5 oz" (nearest ounce, 16 oz to the pound) or "1.5 kg" (two decimals). */
export function chargeWords(kg: number, system: UnitSystem): string {
  if (system === "metric") return `${round(kg, 2)} kg`;
  const totalOz = Math.round(poundsFromKg(kg) * 16);
  const lb = Math.floor(totalOz / 16);
  const oz = totalOz - lb * 16;
  return lb === 0 ? `${oz} oz` : oz === 0 ? `${lb} lb` : `${lb} lb ${oz} oz`;
}

/** 150 psig → "150 psig" or "1034 kPa" (whole kPa, gauge). */
export function pressureWords(psig: number, system: UnitSystem): string {
  return system === "metric" ? `${Math.round(kpaFromPsi(psig))} kPa` : `${round(psig, 1)} psig`;
}

/** A number typed in the system's unit, back to the stored unit (°C, feet, kg, psig). */
export const toStored = {
  temperature: (v: number, system: UnitSystem): number => (system === "metric" ? v : round(celsiusFromFahrenheit(v), 1)),
  length: (v: number, system: UnitSystem): number => (system === "metric" ? round(feetFromMetres(v), 2) : v),
  charge: (v: number, system: UnitSystem): number => (system === "metric" ? v : kgFromPounds(v)),
  pressure: (v: number, system: UnitSystem): number => (system === "metric" ? psiFromKpa(v) : v),
};
