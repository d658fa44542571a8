/**
 * Time integration of a pull-down: the gas balance of the system volume,
 *   V · dp/dt = −Q_pumped(p) + Q_load(t)
 * (V in L, p in microns, throughputs in micron·L/s). Q_pumped is what the pump draws through the
 * path at system pressure p (conductance.ts); Q_load the water and outgassing (planner-load.ts).
 */

/**
 * A monotone throughput Q(p) given as points (pressures falling, any units), interpolated linearly
 * in ln(p − pu) / ln Q, with its slope dQ/dp. Above the first point it keeps the first segment's
 * slope; below the last, Q falls in proportion to (p − pu).
 */
export function tabulateThroughput(points: { microns: readonly number[]; throughput: readonly number[] }, ultimateMicrons: number) {
  const pu = ultimateMicrons;
  const us: number[] = [];
  const lq: number[] = [];
  points.microns.forEach((m, i) => {
    const x = m - pu;
    if (x > 0 && points.throughput[i] > 0 && (us.length === 0 || Math.log(x) < us[us.length - 1])) {
      us.push(Math.log(x));
      lq.push(Math.log(points.throughput[i]));
    }
  });
  if (us.length === 1) {
    us.push(us[0] - 1);
    lq.push(lq[0] - 1);
  }
  const n = us.length;
  const at = (microns: number): { q: number; dqdp: number } => {
    const x = microns - pu;
    if (!(x > 0)) return { q: 0, dqdp: 0 };
    const u = Math.log(x);
    let slope: number;
    let q: number;
    if (u <= us[n - 1]) {
      slope = 1;
      q = Math.exp(lq[n - 1] + (u - us[n - 1]));
    } else {
      // binary search for us[k] ≥ u > us[k + 1]
      let lo = 0;
      let hi = n - 1;
      while (hi - lo > 1) {
        const mid = (lo + hi) >> 1;
        if (us[mid] >= u) lo = mid;
        else hi = mid;
      }
      slope = (lq[hi] - lq[lo]) / (us[hi] - us[lo]);
      q = Math.exp(lq[lo] + slope * (u - us[lo]));
    }
    // d ln q / d ln x = slope  ⇒  dq/dp = slope · q / x
    return { q, dqdp: Math.max(slope * (q / x), 0) };
  };
  return at;
}

export interface LoadedPullDown {
  curve: { tSeconds: number[]; microns: number[] };
  /** null when the target is not reached within `maxSeconds`. */
  timeToTargetSeconds: number | null;
}

/**
 * Integrates V dp/dt = −Q(p) + L(t) from `startMicrons` with a linearised backward Euler step
 * (stable at the quasi-steady balance Q(p) ≈ L(t) the low end of a real pull-down sits on):
 *   Δp = Δt · (L(t + Δt) − Q(p)) / (V + Δt · dQ/dp).
 * Steps change p − pu by about 2 % and the load by at most 2.5 %; the time to the target is
 * interpolated in ln p inside its step. Stops below `endMicrons` or at `maxSeconds`.
 */
export function integrateWithLoad(args: {
  volumeLitres: number;
  startMicrons: number;
  endMicrons: number;
  ultimateMicrons: number;
  targetMicrons: number | null;
  throughputAt: (microns: number) => { q: number; dqdp: number };
  /** Load in micron·L/s at t seconds. */
  loadAt: (tSeconds: number) => number;
  /** Shortest time over which the load changes by e (its release time), seconds. */
  loadTimeScaleSeconds: number;
  maxSeconds: number;
}): LoadedPullDown {
  const { volumeLitres: v, ultimateMicrons: pu, targetMicrons: target } = args;
  let p = args.startMicrons;
  let t = 0;
  const tSeconds = [0];
  const microns = [p];
  let timeToTargetSeconds: number | null = target !== null && p <= target ? 0 : null;
  const dtMax = Math.max(0.5, Math.min(args.loadTimeScaleSeconds / 40, 20));
  while (p > args.endMicrons && t < args.maxSeconds) {
    const { q, dqdp } = args.throughputAt(p);
    const net = args.loadAt(t) - q;
    let dt = Math.abs(net) > 0 ? (0.02 * v * (p - pu)) / Math.abs(net) : dtMax;
    dt = Math.min(Math.max(dt, 1e-3), dtMax);
    const dp = (dt * (args.loadAt(t + dt) - q)) / (v + dt * dqdp);
    let next = p + dp;
    if (next <= pu) next = pu + (p - pu) * 0.5;
    if (timeToTargetSeconds === null && target !== null && next <= target) {
      const f = p === next ? 1 : (Math.log(p) - Math.log(target)) / (Math.log(p) - Math.log(next));
      timeToTargetSeconds = t + dt * Math.min(1, Math.max(0, f));
    }
    // Equilibrium above the end with a load that no longer falls: stop rather than spin.
    if (Math.abs(next - p) < 1e-12 * p && dt === dtMax && args.loadAt(t) === args.loadAt(t + dtMax)) break;
    t += dt;
    p = next;
    const last = microns[microns.length - 1];
    if (Math.abs(Math.log(last) - Math.log(p)) > 0.02 || t - tSeconds[tSeconds.length - 1] > 20) {
      tSeconds.push(t);
      microns.push(p);
    }
  }
  if (tSeconds[tSeconds.length - 1] !== t) {
    tSeconds.push(t);
    microns.push(p);
  }
  return { curve: { tSeconds, microns }, timeToTargetSeconds };
}

/**
 * Integrates dp/dt = −S(p)·(p − pu)/V from startMicrons down to endMicrons (V in L, S in L/s).
 * In u = ln(p − pu) the equation is du/dt = −S/V, so t = ∫ V/S(p(u)) du, done by the trapezoid
 * rule on `steps` equal steps in u (exact for constant S: t = (V/S) ln((p0 − pu)/(p − pu))).
 * The time to `targetMicrons` is interpolated linearly in u inside its step.
 */
export function integratePullDown(args: {
  volumeLitres: number;
  startMicrons: number;
  endMicrons: number;
  ultimateMicrons: number;
  targetMicrons: number | null;
  speedLpsAt: (microns: number) => number;
  steps: number;
}): { curve: { tSeconds: number[]; microns: number[] }; timeToTargetSeconds: number | null } {
  const pu = args.ultimateMicrons;
  const u0 = Math.log(args.startMicrons - pu);
  const u1 = Math.log(args.endMicrons - pu);
  const uTarget = args.targetMicrons !== null && args.targetMicrons > pu ? Math.log(args.targetMicrons - pu) : -Infinity;
  const secondsPerU = (u: number) => args.volumeLitres / args.speedLpsAt(pu + Math.exp(u));
  const tSeconds = [0];
  const microns = [args.startMicrons];
  let timeToTargetSeconds: number | null = uTarget >= u0 ? 0 : null;
  const du = (u0 - u1) / args.steps;
  let prevRate = secondsPerU(u0);
  let t = 0;
  for (let k = 1; k <= args.steps; k++) {
    const u = u0 - k * du;
    const rate = secondsPerU(u);
    const dt = ((prevRate + rate) / 2) * du;
    if (timeToTargetSeconds === null && u <= uTarget) timeToTargetSeconds = t + dt * ((u0 - (k - 1) * du - uTarget) / du);
    t += dt;
    tSeconds.push(t);
    microns.push(pu + Math.exp(u));
    prevRate = rate;
  }
  return { curve: { tSeconds, microns }, timeToTargetSeconds };
}
