/**
 * Reliability of a set of verdicts: confidence bins against the share that was right, the expected
 * calibration error and how many wrong verdicts claimed 80 % or more.
 *
 * ECE = Σ_b (n_b / N)·|acc_b − conf_b| over equal-width bins of the stated confidence (10 bins of
 * 0.1), acc_b the share of right verdicts and conf_b the mean confidence in bin b: C. Guo, G. Pleiss,
 * Y. Sun, K. Q. Weinberger, "On Calibration of Modern Neural Networks", ICML 2017, eq. (3); the table
 * is the reliability diagram of M. H. DeGroot & S. E. Fienberg, "The Comparison and Evaluation of
 * Forecasters", The Statistician 32 (1983), in rows.
 */
export interface Judged {
  confidence: number;
  right: boolean;
}

export interface Reliability {
  bins: { from: number; to: number; n: number; meanConfidence: number; accuracy: number }[];
  ece: number;
  n: number;
  accuracy: number;
  /** Wrong verdicts with confidence ≥ 0.8, and their share of all verdicts. */
  confidentWrong: number;
  confidentWrongShare: number;
}

export function reliabilityOf(items: Judged[], binCount = 10): Reliability {
  const bins = Array.from({ length: binCount }, (_, b) => ({ from: b / binCount, to: (b + 1) / binCount, n: 0, sumConf: 0, right: 0 }));
  for (const it of items) {
    const b = Math.min(binCount - 1, Math.max(0, Math.floor(it.confidence * binCount)));
    bins[b].n++;
    bins[b].sumConf += it.confidence;
    if (it.right) bins[b].right++;
  }
  const n = items.length;
  let ece = 0;
  for (const b of bins) if (b.n) ece += (b.n / n) * Math.abs(b.right / b.n - b.sumConf / b.n);
  const confidentWrong = items.filter((x) => !x.right && x.confidence >= 0.8).length;
  return {
    bins: bins.map((b) => ({ from: b.from, to: b.to, n: b.n, meanConfidence: b.n ? b.sumConf / b.n : NaN, accuracy: b.n ? b.right / b.n : NaN })),
    ece,
    n,
    accuracy: n ? items.filter((x) => x.right).length / n : NaN,
    confidentWrong,
    confidentWrongShare: n ? confidentWrong / n : 0,
  };
}

/** The reliability table as printed lines. */
export function reliabilityLines(title: string, r: Reliability): string[] {
  const pct = (x: number) => (Number.isFinite(x) ? `${(100 * x).toFixed(1)} %` : "—");
  const lines = [
    `${title}: ${r.n} verdicts, ${pct(r.accuracy)} right; ECE ${r.ece.toFixed(3)} (goal ≤ 0.05); wrong at ≥ 80 %: ${r.confidentWrong} = ${pct(r.confidentWrongShare)} (goal < 2 %)`,
    "  confidence     n   mean conf   right",
  ];
  for (const b of r.bins) {
    if (!b.n) continue;
    lines.push(`  ${b.from.toFixed(1)}–${b.to.toFixed(1)}  ${String(b.n).padStart(6)}   ${pct(b.meanConfidence).padStart(8)}  ${pct(b.accuracy).padStart(7)}`);
  }
  return lines;
}
