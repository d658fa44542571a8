import type { AnalysisResult } from "@/analysis/decay/types";
import type { VacuumTestDto } from "@/lib/client/api";
import { useUnits } from "@/lib/units/context";
import { lengthWords, temperatureWords } from "@/lib/units/format";
import { UNIT_LABELS } from "../new/ColumnChooser";

/** How the log was read and the context recorded with it. */
export function ImportPanel({ analysis, test }: { analysis: AnalysisResult; test: VacuumTestDto }) {
  const s = analysis.import;
  const units = useUnits();
  const ctx: [string, string | number | null | undefined][] = [
    ["Refrigerant", test.refrigerant],
    ["Line set", test.lineSetFeet ? `${lengthWords(test.lineSetFeet, units)}, ${test.liquidOd ?? "?"}″ / ${test.suctionOd ?? "?"}″` : null],
    ["Volume", test.volumeLitres != null ? `${test.volumeLitres} L` : null],
    ["Ambient", test.ambientC != null ? temperatureWords(test.ambientC, units) : null],
    ["Rig", test.rigNote],
    ["Internal notes", test.notes],
  ];
  return (
    <details className="mt-3">
      <summary className="inline-flex min-h-tap cursor-pointer items-center text-body font-medium text-tide-700 underline dark:text-tide-300">How the log was read</summary>
      <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-body">
        <dt className="text-fg-soft">Columns</dt>
        <dd>time “{s.timeColumn}”, pressure “{s.pressureColumn}”</dd>
        <dt className="text-fg-soft">Unit</dt>
        <dd>{UNIT_LABELS[s.unit] ?? s.unit}</dd>
        <dt className="text-fg-soft">Rows</dt>
        <dd>
          {s.rows.toLocaleString("en-US")} ({s.skipped} skipped{s.overRange ? `, ${s.overRange} over range` : ""})
        </dd>
        {ctx
          .filter(([, v]) => v != null && v !== "")
          .map(([k, v]) => (
            <div key={k} className="contents">
              <dt className="text-fg-soft">{k}</dt>
              <dd className="break-words">{v}</dd>
            </div>
          ))}
      </dl>
      {analysis.holds.some((h) => h.fit) && (
        <p className="mt-2 text-caption text-fg-soft">Curve model: {analysis.holds.map((h) => h.fit?.rule).filter(Boolean).join("; ")}</p>
      )}
      {s.assumptions.length > 0 && (
        <ul className="mt-2 list-disc pl-5 text-caption text-fg-soft">
          {s.assumptions.map((a) => <li key={a}>{a}</li>)}
        </ul>
      )}
    </details>
  );
}
