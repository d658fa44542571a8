import type { AnalysisResult } from "@/analysis/types";
import { Card } from "@/components/ui";
import { durationWords, microns } from "./format";

/** Where the hold is heading at the profile's hold time, and the early call when the band allows one. */
export function ForecastPanel({ analysis }: { analysis: AnalysisResult }) {
  const f = analysis.forecast;
  if (!f) return null;
  const call =
    f.earlyCall === "pass"
      ? { words: "Early call: it will pass", note: "The whole forecast band stays under the limit.", cls: "text-verdict-pass dark:text-green-300" }
      : f.earlyCall === "fail"
        ? { words: "Early call: it will not pass", note: "The whole forecast band is over the limit.", cls: "text-verdict-leak dark:text-orange-300" }
        : { words: "Too early to call", note: "The forecast band crosses the limit; keep holding.", cls: "text-fg" };
  return (
    <Card title="Forecast">
      <p className={`text-lead font-semibold ${call.cls}`} data-testid="early-call">{call.words}</p>
      <p className="text-body text-fg-soft">{call.note}</p>
      <p className="mt-3 text-body">
        At {durationWords(f.atHoldSeconds)} of hold: about <span className="font-semibold tabular-nums">{microns(f.predictedMicrons)} microns</span>{" "}
        (95 % band {microns(f.lowMicrons)}–{microns(f.highMicrons)}), limit {microns(analysis.profile.limitMicrons)}.
      </p>
      <p className="text-caption text-fg-soft">From {durationWords(f.basedOnSeconds)} of hold data.</p>
    </Card>
  );
}
