/**
 * The fitting core against NIST Statistical Reference Datasets (StRD): certified values are NIST's
 * best available solutions (computed in 128-bit arithmetic), data and values as in
 * /work/shared/reference/NIST-STRD.md.
 *
 * Tolerance: "to N significant digits" means |got − certified| ≤ 0.5·10^(1−N)·|certified|
 * (NIST suggests a good solver reaches about 6 digits; we ask more — 8 to 10 — where the double-precision
 * QR solver was measured to reach them, so a regression shows before it matters).
 */
import { describe, expect, it } from "vitest";
import { fitNonlinear, type NonlinearModel } from "@/analysis/decay/fit/nls";
import { fitStraightLine } from "@/analysis/decay/fit/linear";

function expectDigits(got: number, certified: number, digits: number) {
  const tol = 0.5 * 10 ** (1 - digits) * Math.abs(certified);
  expect(Math.abs(got - certified), `got ${got}, certified ${certified}`).toBeLessThanOrEqual(tol);
}

/** Same exponential-rise shape as the plateau hold model: y = b1·(1 − exp(−b2·x)). */
const exponentialRise: NonlinearModel = {
  value: (x, b) => b[0] * (1 - Math.exp(-b[1] * x)),
  gradient: (x, b, out) => {
    const e = Math.exp(-b[1] * x);
    out[0] = 1 - e;
    out[1] = b[0] * x * e;
  },
};

/** The same model without an analytic gradient (central differences inside the solver). */
const exponentialRiseNumeric: NonlinearModel = { value: exponentialRise.value };

const misra1aX = [77.6, 114.9, 141.1, 190.8, 239.9, 289.0, 332.8, 378.4, 434.8, 477.3, 536.8, 593.1, 689.1, 760.0];
const misra1aY = [10.07, 14.73, 17.94, 23.93, 29.61, 35.18, 40.02, 44.82, 50.76, 55.05, 61.01, 66.4, 75.47, 81.78];

const boxbodX = [1, 2, 3, 5, 7, 10];
const boxbodY = [109, 149, 149, 191, 213, 224];

describe("fitNonlinear — NIST StRD Misra1a (lower difficulty)", () => {
  const certified = {
    b: [2.3894212918e2, 5.5015643181e-4],
    sd: [2.707007524e0, 7.2668688436e-6],
    rss: 1.2455138894e-1,
    residualSd: 1.018787633e-1,
    dof: 12,
  };
  for (const start of [
    [500, 1e-4],
    [250, 5e-4],
  ]) {
    for (const [label, model] of [
      ["analytic", exponentialRise],
      ["numeric", exponentialRiseNumeric],
    ] as const) {
      it(`reproduces Misra1a b1, b2, sd, RSS, residual sd to 9 digits from start ${start} (${label} Jacobian) (NIST StRD Misra1a certified values)`, () => {
        const fit = fitNonlinear(model, misra1aX, misra1aY, start);
        expect(fit.stopReason).toBe("converged");
        expect(fit.dof).toBe(certified.dof);
        // 9 of the 11 certified digits (measured 9.2–11.6): the minimum is well conditioned after
        // column scaling; the standard errors still reach 9 with central differences.
        for (const [got, want] of [
          [fit.params[0], certified.b[0]],
          [fit.params[1], certified.b[1]],
          [fit.stdErrors[0], certified.sd[0]],
          [fit.stdErrors[1], certified.sd[1]],
          [fit.rss, certified.rss],
          [fit.residualSd, certified.residualSd],
        ])
          expectDigits(got, want, 9);
      });
    }
  }
});

describe("fitNonlinear — NIST StRD BoxBOD (higher difficulty)", () => {
  const certified = {
    b: [2.1380940889e2, 5.4723748542e-1],
    sd: [1.2354515176e1, 1.0455993237e-1],
    rss: 1.1680088766e3,
    residualSd: 1.7088072423e1,
    dof: 4,
  };
  for (const start of [
    [1, 1],
    [100, 0.75],
  ]) {
    it(`reproduces BoxBOD b1, b2, sd, RSS, residual sd to 8 digits from start ${start} (NIST StRD BoxBOD certified values)`, () => {
      const fit = fitNonlinear(exponentialRise, boxbodX, boxbodY, start);
      expect(fit.stopReason).toBe("converged");
      expect(fit.dof).toBe(certified.dof);
      // 8 of the 11 certified digits (measured 8.4–11.1); the harder start (1, 1) first has to be kept
      // from sending b2 to a flat region (see maxRelativeStep in nls.ts).
      expectDigits(fit.params[0], certified.b[0], 8);
      expectDigits(fit.params[1], certified.b[1], 8);
      expectDigits(fit.stdErrors[0], certified.sd[0], 8);
      expectDigits(fit.stdErrors[1], certified.sd[1], 8);
      expectDigits(fit.rss, certified.rss, 8);
      expectDigits(fit.residualSd, certified.residualSd, 8);
    });
  }
});

describe("fitStraightLine — NIST StRD Norris (linear, lower difficulty)", () => {
  const x = [
    0.2, 337.4, 118.2, 884.6, 10.1, 226.5, 666.3, 996.3, 448.6, 777.0, 558.2, 0.4, 0.6, 775.5, 666.9, 338.0, 447.5,
    11.6, 556.0, 228.1, 995.8, 887.6, 120.2, 0.3, 0.3, 556.8, 339.1, 887.2, 999.0, 779.0, 11.1, 118.3, 229.2, 669.1,
    448.9, 0.5,
  ];
  const y = [
    0.1, 338.8, 118.1, 888.0, 9.2, 228.1, 668.5, 998.5, 449.1, 778.9, 559.2, 0.3, 0.1, 778.1, 668.8, 339.3, 448.9,
    10.8, 557.7, 228.3, 998.0, 888.8, 119.6, 0.3, 0.6, 557.6, 339.3, 888.0, 998.5, 778.9, 10.2, 117.6, 228.9, 668.4,
    449.2, 0.2,
  ];
  it("reproduces Norris B0, B1, their sd, residual sd, R² and SSE to 10 digits (NIST StRD Norris certified values)", () => {
    const fit = fitStraightLine(x, y);
    // 10 digits: a well-conditioned linear problem solved by QR loses at most ~3 of double's 16 digits.
    expectDigits(fit.b0, -0.262323073774029, 10);
    expectDigits(fit.b1, 1.00211681802045, 10);
    expectDigits(fit.sdB0, 0.232818234301152, 10);
    expectDigits(fit.sdB1, 0.429796848199937e-3, 10);
    expectDigits(fit.residualSd, 0.884796396144373, 10);
    expectDigits(fit.rSquared, 0.999993745883712, 10);
    expectDigits(fit.rss, 26.6173985294224, 10);
    expect(fit.dof).toBe(34);
  });
});

describe("fitNonlinear — honest stop reasons", () => {
  it("reports non_finite when the model gives NaN at the start (no published source: solver contract)", () => {
    const fit = fitNonlinear({ value: () => NaN }, [1, 2, 3], [1, 2, 3], [1]);
    expect(fit.stopReason).toBe("non_finite");
  });
  it("reports iteration_limit when stopped early (no published source: solver contract)", () => {
    const fit = fitNonlinear(exponentialRise, boxbodX, boxbodY, [1, 1], { maxIterations: 2 });
    expect(fit.stopReason).toBe("iteration_limit");
    expect(fit.iterations).toBe(2);
  });
});
