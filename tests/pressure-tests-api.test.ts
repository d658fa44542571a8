import { beforeAll, describe, expect, it } from "vitest";
import { GET as listTests, POST as createTest } from "@/app/api/pressure-tests/route";
import { GET as getTest } from "@/app/api/pressure-tests/[id]/route";
import type { Role } from "@/lib/permissions";
import { appRequest, createCrew, createShop, routeParams, type TestMember } from "./helpers/members";

const post = (body: unknown, as: TestMember) => ({ method: "POST", body: JSON.stringify(body), headers: { "content-type": "application/json" }, as });

describe("/api/pressure-tests", () => {
  let crew: Record<Role, TestMember>;
  let outsider: TestMember;
  let typedId: string;

  beforeAll(async () => {
    crew = await createCrew();
    outsider = await createShop();
  });

  it("records typed readings and answers 294.17 psig expected (CHECK-VALUES worked example (ideal gas, computed))", async () => {
    const res = await createTest(
      appRequest(
        "/api/pressure-tests",
        post({ source: "typed", unit: "psig", temperatureUnit: "F", start: { pressureGauge: 300, temperature: 80 }, end: { pressureGauge: 288, temperature: 70 }, ratedTestPressureGauge: 450 }, crew.technician),
      ),
    );
    expect(res.status).toBe(201);
    const body = await res.json();
    typedId = body.test.id;
    // Half the last printed digit of the worked example.
    expect(Math.abs(body.result.expectedEndGauge - 294.17)).toBeLessThan(0.005);
    expect(body.test.verdict).toBe("drops");
    expect(body.result.cautions.length).toBeGreaterThan(0);
  });

  it("reads a logger CSV in psia as absolute and turns it into psig (14.696 psi atmosphere)", async () => {
    const csvText = "time,pressure psia,temp °F\n2026-05-01 08:00:00,314.696,80\n2026-05-01 09:00:00,311.5,75\n2026-05-01 10:00:00,308.865,70\n";
    const res = await createTest(appRequest("/api/pressure-tests", post({ source: "file", csvText, temperatureUnit: "F", ratedTestPressureGauge: 450 }, crew.technician)));
    expect(res.status).toBe(201);
    const body = await res.json();
    expect(body.test.unit).toBe("psig");
    expect(body.test.startPressure).toBeCloseTo(300, 9);
    expect(body.test.durationSeconds).toBe(7200);
    expect(body.test.verdict).toBe("holds");
    expect(body.assumptions.join(" ")).toMatch(/absolute/);
  });

  it("answers 422 for a bare 'psi' log until told gauge or absolute", async () => {
    const csvText = "time_s,psi,temp C\n0,300,20\n60,300,20\n";
    const bad = await createTest(appRequest("/api/pressure-tests", post({ source: "file", csvText, temperatureUnit: "C" }, crew.technician)));
    expect(bad.status).toBe(422);
    const ok = await createTest(appRequest("/api/pressure-tests", post({ source: "file", csvText, temperatureUnit: "C", ambiguousAs: "gauge" }, crew.technician)));
    expect(ok.status).toBe(201);
  });

  it("warns when the test went above the nameplate rating", async () => {
    const res = await createTest(
      appRequest("/api/pressure-tests", post({ source: "typed", unit: "bar_gauge", temperatureUnit: "C", start: { pressureGauge: 45, temperature: 20 }, end: { pressureGauge: 45, temperature: 20 }, ratedTestPressureGauge: 40 }, crew.technician)),
    );
    const body = await res.json();
    expect(body.result.warnings.map((w: { code: string }) => w.code)).toContain("above_rated_pressure");
  });

  it("technicians see their own tests; leads see all; another shop gets 404", async () => {
    const mine = await (await listTests(appRequest("/api/pressure-tests", { as: crew.technician }))).json();
    expect(mine.items.map((t: { id: string }) => t.id)).toContain(typedId);
    const lead = await getTest(appRequest(`/api/pressure-tests/${typedId}`, { as: crew.lead }), routeParams({ id: typedId }));
    expect(lead.status).toBe(200);
    const apprentice = await getTest(appRequest(`/api/pressure-tests/${typedId}`, { as: crew.apprentice }), routeParams({ id: typedId }));
    expect(apprentice.status).toBe(404);
    const foreign = await getTest(appRequest(`/api/pressure-tests/${typedId}`, { as: outsider }), routeParams({ id: typedId }));
    expect(foreign.status).toBe(404);
  });

  it("refuses a job from another shop (400)", async () => {
    const res = await createTest(
      appRequest("/api/pressure-tests", post({ source: "typed", unit: "psig", temperatureUnit: "F", jobId: "00000000-0000-4000-8000-000000000000", start: { pressureGauge: 300, temperature: 80 }, end: { pressureGauge: 300, temperature: 80 } }, crew.technician)),
    );
    expect(res.status).toBe(400);
  });
});
