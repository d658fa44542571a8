/**
 * Typed readings as the CSV a gauge would have written, and the engine options that go with them.
 * Pure (no env, no I/O): the upload route and `npm run eval:analysis` / `npm run calibrate` use the
 * same conversion, so typed logs are judged and calibrated exactly as the product reads them.
 */
import type { AnalyzeOptions } from "@/analysis/decay/types";

export interface TypedReadingsInput {
  timeMode: "clock" | "minutes";
  readings: { time: string | number; microns: number }[];
}

/** Two digits. */
const pad = (n: number) => String(n).padStart(2, "0");

/**
 * The CSV text and the importer choices. With "minutes since isolation" the first typed reading is
 * the isolation itself (the technician starts the count when the pump is valved off), so the
 * engine is told so instead of looking for a pull-down the readings do not contain. Clock times
 * may include readings of the pull-down, so there the engine finds the isolation itself.
 */
export function typedReadingsToCsv(r: TypedReadingsInput): { text: string; importDefaults: NonNullable<AnalyzeOptions["import"]>; isolationAtSeconds?: number } {
  if (r.timeMode === "clock") {
    const lines = r.readings.map((x) => {
      const [h, m, s = "00"] = String(x.time).trim().split(":");
      return `${pad(Number(h))}:${m}:${s.length === 1 ? `0${s}` : s},${x.microns}`;
    });
    return { text: ["Time,Vacuum (microns)", ...lines].join("\n") + "\n", importDefaults: { timeColumn: 0, pressureColumn: 1, unit: "micron" } };
  }
  const lines = r.readings.map((x) => `${Number(x.time)},${x.microns}`);
  return {
    text: ["Elapsed (min),Vacuum (microns)", ...lines].join("\n") + "\n",
    importDefaults: { timeColumn: 0, pressureColumn: 1, unit: "micron", timeUnit: "min" },
    // Seconds from the first data row: the first typed reading is t = 0.
    isolationAtSeconds: 0,
  };
}
