/**
 * What-ifs beside a plan: the same system with one thing changed (3/8 in or 1/4 in hoses, hoses
 * half as long, cores out, no manifold) and all the improvements together, each with its own range,
 * and how each compares with the plan as entered in words that are never a negative saving.
 */
import { planPullDown, type Plan, type PlannerInput } from "./planner";

export interface WhatIf {
  key: "as_planned" | "hoses_3_8" | "hoses_1_4" | "shorter_hoses" | "cores_out" | "no_manifold" | "best";
  label: string;
  plan: Plan;
}

/** 3/8 in and 1/4 in nominal hose bores, inches. */
export const HOSE_ID_3_8_IN = 0.375;
export const HOSE_ID_1_4_IN = 0.25;

/** The plan as entered beside what-ifs that change one thing each and the best of all of them together. */
export function planWhatIfs(input: PlannerInput): WhatIf[] {
  const out: WhatIf[] = [{ key: "as_planned", label: "As planned", plan: planPullDown(input) }];
  const h = input.hoses;
  if (Math.abs(h.insideDiameterIn - HOSE_ID_3_8_IN) > 1e-9)
    out.push({ key: "hoses_3_8", label: "3/8 in hoses", plan: planPullDown({ ...input, hoses: { ...h, insideDiameterIn: HOSE_ID_3_8_IN } }) });
  if (Math.abs(h.insideDiameterIn - HOSE_ID_1_4_IN) > 1e-9)
    out.push({ key: "hoses_1_4", label: "1/4 in hoses", plan: planPullDown({ ...input, hoses: { ...h, insideDiameterIn: HOSE_ID_1_4_IN } }) });
  out.push({ key: "shorter_hoses", label: `Hoses ${h.lengthFt / 2} ft`, plan: planPullDown({ ...input, hoses: { ...h, lengthFt: h.lengthFt / 2 } }) });
  if (!input.coresRemoved) out.push({ key: "cores_out", label: "Cores out", plan: planPullDown({ ...input, coresRemoved: true }) });
  if (input.manifold) out.push({ key: "no_manifold", label: "No manifold", plan: planPullDown({ ...input, manifold: false }) });
  const best: PlannerInput = {
    ...input,
    coresRemoved: true,
    manifold: false,
    hoses: { ...h, insideDiameterIn: Math.max(h.insideDiameterIn, HOSE_ID_3_8_IN), lengthFt: h.lengthFt / 2 },
  };
  out.push({ key: "best", label: "All of these together", plan: planPullDown(best) });
  return out;
}

/**
 * A what-if's likely time against the plan's, in words: "saves 35 %", "12 % slower", "about
 * the same" (within 1 %), "—" when either never gets there. Never a negative saving.
 */
export function comparedWords(seconds: number | null, baseSeconds: number | null): string {
  if (seconds === null || baseSeconds === null || !(baseSeconds > 0)) return "—";
  const change = 1 - seconds / baseSeconds;
  if (Math.abs(change) < 0.01) return "about the same";
  return change > 0 ? `saves ${Math.round(change * 100)} %` : `${Math.round(-change * 100)} % slower`;
}
