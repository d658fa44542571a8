/**
 * One or two wild readings in the judged hold (a bumped hose, a hand on the gauge, a wireless glitch),
 * left out of the fit: listed so the technician can see what was set aside and why. Common practice,
 * no published source.
 */
import type { Finding } from "../types";
import type { DiagnoseContext } from "./context";
import { finding } from "./wording";

const clock = (s: number): string => `${Math.floor(s / 60)}:${String(Math.round(s % 60)).padStart(2, "0")}`;

export function spikeFindings(ctx: DiagnoseContext): Finding[] {
  const k = ctx.phases.phases.primary;
  if (k === null) return [];
  const seconds = ctx.phases.phases.holds[k].spikeSeconds ?? [];
  if (seconds.length === 0) return [];
  const shown = seconds.slice(0, 6).map(clock).join(", ");
  return [
    finding(
      "spikes_left_out",
      "info",
      seconds.length === 1 ? "A wild reading left out" : "Wild readings left out",
      `${seconds.length === 1 ? "One reading" : `${seconds.length} readings`} in the hold (at ${shown}${seconds.length > 6 ? ", …" : ""} from the start of the log) jumped far off the curve and straight back. A bumped hose or a hand on the gauge does that; they were left out of the fit.`,
      { spikes: seconds.length, firstSpikeSeconds: Math.round(seconds[0]) },
      ["If the hose or the gauge was knocked during the hold, check the connections are still tight."],
      [],
      seconds[0],
    ),
  ];
}
