/** The evaluation's calibration section: reliability tables on held-out simulated, typed and independent logs. */
import { analyzeLog } from "../../analysis";
import { independentLogs } from "./independent";
import { reliabilityLines, reliabilityOf, type Judged } from "./reliability";
import { typedSet } from "./training";
import { contradicts } from "./early-call";

/** Lines for the evaluation; `simulated` and `field` are the main loop's and the field part's verdicts (held-out seeds). */
export function calibrationLines(simulated: Judged[], independentCount: number, field: Judged[] = []): string[] {
  const typed = typedSet(600, 300001).map((l) => ({ confidence: l.confidence, right: l.right }));
  const ind: Judged[] = [];
  const indTyped: Judged[] = [];
  const confusion = new Map<string, number>();
  let contradictions = 0;
  let errors = 0;
  for (const log of independentLogs(independentCount)) {
    try {
      const r = analyzeLog(log.text, log.options);
      (log.kind === "typed" ? indTyped : ind).push({ confidence: r.confidence, right: r.verdict === log.truth.verdict });
      const k = `${log.truth.verdict}→${r.verdict}`;
      confusion.set(k, (confusion.get(k) ?? 0) + 1);
      if (contradicts(r)) contradictions++;
    } catch {
      errors++;
    }
  }
  return [
    "confidence calibration (reliability table: stated confidence against the share right; Guo et al. 2017, DeGroot & Fienberg 1983):",
    ...reliabilityLines("simulated gauge logs (held out)", reliabilityOf(simulated)),
    ...reliabilityLines("typed logs from the simulator (held out)", reliabilityOf(typed)),
    ...(field.length ? reliabilityLines("field logs (held out)", reliabilityOf(field)) : []),
    ...reliabilityLines(`independent set, all (${independentCount} logs, ${errors} unreadable)`, reliabilityOf([...ind, ...indTyped])),
    ...reliabilityLines("independent set, typed only", reliabilityOf(indTyped)),
    `independent set verdicts (truth→result): ${[...confusion].sort().map(([k, n]) => `${k} ${n}`).join(", ")}; early calls contradicting the verdict: ${contradictions}`,
  ];
}
