/** All findings on an analysed log, in a stable order: hold first (and its spikes), then pull-down, then sensor. */
import type { Finding } from "../types";
import type { DiagnoseContext } from "./context";
import { holdFindings } from "./hold";
import { pulldownFindings } from "./pulldown";
import { sensorFindings } from "./sensor";
import { spikeFindings } from "./spikes";

export type { DiagnoseContext } from "./context";
export { CAUTION_CODES, CAUTION_COMPRESSOR, CAUTION_NITROGEN } from "./wording";

export function diagnose(ctx: DiagnoseContext): Finding[] {
  return holdFindings(ctx).concat(spikeFindings(ctx), pulldownFindings(ctx), sensorFindings(ctx));
}
