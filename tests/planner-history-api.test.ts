import { beforeAll, describe, expect, it } from "vitest";
import { GET as history } from "@/app/api/planner/history/route";
import type { PlannerHistory } from "@/lib/planner/history";
import { appRequest, createCrew, createShop, type TestMember } from "./helpers/members";
import { recordDemoSystem } from "./helpers/planner-system";
import type { Role } from "@/lib/permissions";

describe("/api/planner/history — a system's recorded pull-downs beside the plan (common practice, no published source)", () => {
  let crew: Record<Role, TestMember>;
  let recorded: Awaited<ReturnType<typeof recordDemoSystem>>;

  beforeAll(async () => {
    crew = await createCrew();
    recorded = await recordDemoSystem(crew.technician);
  }, 120_000);

  it("shows each test's recorded time beside the plan for its kit, within a factor of 2, with the assumptions", async () => {
    const res = await history(appRequest(`/api/planner/history?systemId=${recorded.systemId}`, { as: crew.lead }));
    expect(res.status).toBe(200);
    const body: PlannerHistory = await res.json();
    expect(body.system.name).toBe(recorded.systemName);
    expect(body.pullDowns.map((p) => p.testId).sort()).toEqual([...recorded.testIds].sort());
    for (const p of body.pullDowns) {
      expect(p.recordedSeconds!).toBeGreaterThan(0);
      expect(p.plan!.fastSeconds!).toBeLessThan(p.plan!.slowSeconds!);
      expect(p.ratio!).toBeGreaterThanOrEqual(0.5);
      expect(p.ratio!).toBeLessThanOrEqual(2);
      expect(p.assumptions.join(" ")).toMatch(/Pump \d+ CFM/);
      expect(p.rigName).toMatch(/Van/);
    }
    expect(body.summary.compared).toBe(recorded.testIds.length);
  });

  it("an apprentice sees none of the technician's tests; another shop gets 404; a bad id 400; no session 401", async () => {
    const other = await (await history(appRequest(`/api/planner/history?systemId=${recorded.systemId}`, { as: crew.apprentice }))).json();
    expect(other.pullDowns).toEqual([]);
    const foreign = await history(appRequest(`/api/planner/history?systemId=${recorded.systemId}`, { as: await createShop() }));
    expect(foreign.status).toBe(404);
    expect((await history(appRequest("/api/planner/history?systemId=nope", { as: crew.lead }))).status).toBe(400);
    expect((await history(appRequest(`/api/planner/history?systemId=${recorded.systemId}`, { as: null }))).status).toBe(401);
  });
});
