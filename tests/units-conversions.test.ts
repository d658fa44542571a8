/** Conversions and quantities in words of lib/units, checked against NIST SP 811 (2008), appendix B. */
import { describe, expect, it } from "vitest";
import {
  celsiusFromFahrenheit,
  effectiveUnitSystem,
  fahrenheitFromCelsius,
  feetFromMetres,
  kgFromPounds,
  kpaFromPsi,
  metresFromFeet,
  poundsFromKg,
  psiFromKpa,
} from "@/lib/units/convert";
import { chargeWords, lengthWords, pressureWords, temperatureWords, toStored } from "@/lib/units/format";
import { contextFields, EMPTY_CONTEXT } from "@/app/(app)/vacuum-tests/new/context";

describe("conversion factors (NIST SP 811, appendix B.8/B.9)", () => {
  it("1 ft = 0.3048 m exactly (NIST SP 811 B.8, foot)", () => {
    expect(metresFromFeet(1)).toBe(0.3048);
    expect(metresFromFeet(100)).toBeCloseTo(30.48, 12);
    expect(feetFromMetres(0.3048)).toBe(1);
  });
  it("1 lb = 0.45359237 kg exactly (NIST SP 811 B.8, pound avoirdupois)", () => {
    expect(kgFromPounds(1)).toBe(0.45359237);
    expect(poundsFromKg(0.45359237)).toBe(1);
  });
  it("1 psi = 6.894757 kPa (NIST SP 811 B.8, pound-force per square inch)", () => {
    expect(kpaFromPsi(1)).toBe(6.894757);
    expect(kpaFromPsi(150)).toBeCloseTo(1034.21355, 5);
    expect(psiFromKpa(6.894757)).toBe(1);
  });
  it("t/°F = t/°C · 9/5 + 32 (NIST SP 811 B.9, temperature)", () => {
    expect(fahrenheitFromCelsius(0)).toBe(32);
    expect(fahrenheitFromCelsius(100)).toBe(212);
    expect(fahrenheitFromCelsius(-40)).toBe(-40);
    expect(celsiusFromFahrenheit(50)).toBe(10);
  });
});

describe("quantities in words (NIST SP 811 factors; rounding is our own choice, no source)", () => {
  it("temperature: whole °F for imperial, tenths of °C for metric", () => {
    expect(temperatureWords(21.5, "imperial")).toBe("71 °F");
    expect(temperatureWords(21.5, "metric")).toBe("21.5 °C");
  });
  it("length: feet or metres to the tenth (25 ft = 7.62 m)", () => {
    expect(lengthWords(25, "imperial")).toBe("25 ft");
    expect(lengthWords(25, "metric")).toBe("7.6 m");
  });
  it("charge: pounds and whole ounces, or kilograms (1.5 kg = 3.307 lb = 3 lb 5 oz)", () => {
    expect(chargeWords(1.5, "imperial")).toBe("3 lb 5 oz");
    expect(chargeWords(1.5, "metric")).toBe("1.5 kg");
    expect(chargeWords(0.45359237, "imperial")).toBe("1 lb");
  });
  it("gauge pressure: psig or whole kPa (150 psig = 1034 kPa)", () => {
    expect(pressureWords(150, "imperial")).toBe("150 psig");
    expect(pressureWords(150, "metric")).toBe("1034 kPa");
  });
  it("typed values go back to the stored units (°C, feet, kg, psig)", () => {
    expect(toStored.temperature(50, "imperial")).toBe(10);
    expect(toStored.length(7.62, "metric")).toBe(25);
    expect(toStored.charge(1, "imperial")).toBe(0.45359237);
    expect(toStored.pressure(6.894757, "metric")).toBe(1);
  });
  it("a person's own choice wins over the shop's; none follows the shop", () => {
    expect(effectiveUnitSystem("metric", "imperial")).toBe("imperial");
    expect(effectiveUnitSystem("metric", null)).toBe("metric");
  });
});

describe("the upload form stores what is typed in the reader's units in the existing columns", () => {
  it("a line set typed as 7.62 m is sent as 25 feet; 10 °C stays 10 °C (1 ft = 0.3048 m, NIST SP 811)", () => {
    const f = contextFields({ ...EMPTY_CONTEXT, lineSetFeet: "7.62", lengthUnit: "m", ambient: "10", ambientUnit: "C" });
    expect(f.lineSetFeet).toBe(25);
    expect(f.ambientC).toBe(10);
    const imperial = contextFields({ ...EMPTY_CONTEXT, lineSetFeet: "25", ambient: "50", ambientUnit: "F" });
    expect(imperial.lineSetFeet).toBe(25);
    expect(imperial.ambientC).toBe(10);
  });
});
