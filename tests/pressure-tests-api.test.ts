import { beforeAll, describe, expect, it } from "vitest";
import { GET as listTests, POST as createTest } from "@/app/api/pressure-tests/route";
import { GET as getTest } from "@/app/api/pressure-tests/[id]/route";
import type { Role } from "@/lib/permissions";
import { appRequest, createCrew, createShop, routeParams, type TestMember } from "./helpers/members";
import { db } from "@/db/client";
import { createPressureTest } from "@/db/queries/pressure-tests";

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
        post({ source: "typed", unit: "psig", temperatureUnit: "F", start: { pressureGauge: 300, temperature: 80 }, end: { pressureGauge: 288, temperature: 70 }, ratedTestPressureGauge: 450, startedAt: "2026-05-01T08:00:00-05:00", endedAt: "2026-05-01T10:00:00-05:00" }, crew.technician),
      ),
    );
    expect(res.status).toBe(201);
    const body = await res.json();
    typedId = body.test.id;
    // Half the last printed digit of the worked example.
    expect(Math.abs(body.result.expectedEndGauge - 294.17)).toBeLessThan(0.005);
    expect(body.test.verdict).toBe("drops");
    expect(body.result.cautions.length).toBeGreaterThan(0);
    // Start and end time kept; (288 − 294.17) psi over 2 h = −3.08 psi/h after temperature correction (ideal gas, computed).
    expect(body.test.durationSeconds).toBe(7200);
    expect(new Date(body.test.startedAt).toISOString()).toBe("2026-05-01T13:00:00.000Z");
    expect(new Date(body.test.endedAt).toISOString()).toBe("2026-05-01T15:00:00.000Z");
    expect(Math.abs(body.result.ratePerHourGauge + 3.085)).toBeLessThan(0.005);
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
    expect(body.assumptions.join(" ")).toMatch(/absolute/i);
    // The log's clock gives the start time.
    expect(new Date(body.test.startedAt).getTime()).toBe(Date.parse("2026-05-01T08:00:00"));
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
      appRequest("/api/pressure-tests", post({ source: "typed", unit: "bar_gauge", temperatureUnit: "C", start: { pressureGauge: 45, temperature: 20 }, end: { pressureGauge: 45, temperature: 20 }, ratedTestPressureGauge: 40, durationMinutes: 30, overPressureAcknowledged: true }, crew.technician)),
    );
    const body = await res.json();
    expect(body.result.warnings.map((w: { code: string }) => w.code)).toContain("above_rated_pressure");
    expect(body.test.verdict).toBe("stopped");
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
      appRequest("/api/pressure-tests", post({ source: "typed", unit: "psig", temperatureUnit: "F", jobId: "00000000-0000-4000-8000-000000000000", start: { pressureGauge: 300, temperature: 80 }, end: { pressureGauge: 300, temperature: 80 }, durationMinutes: 60 }, crew.technician)),
    );
    expect(res.status).toBe(400);
  });

  const typed = (extra: Record<string, unknown>) => ({
    source: "typed",
    unit: "psig",
    temperatureUnit: "F",
    start: { pressureGauge: 300, temperature: 80 },
    end: { pressureGauge: 294, temperature: 70 },
    ratedTestPressureGauge: 450,
    durationMinutes: 60,
    ...extra,
  });

  it("stops a typed test with a 480 psig reading in the middle against a 450 rating; saving needs the acknowledgement, kept on the record (common practice, no published source)", async () => {
    const over = typed({ readings: [{ minutes: 10, pressureGauge: 320 }, { minutes: 20, pressureGauge: 480 }, { minutes: 40, pressureGauge: 300 }] });
    const refused = await createTest(appRequest("/api/pressure-tests", post(over, crew.technician)));
    expect(refused.status).toBe(400);
    const err = (await refused.json()).error;
    expect(err.details.field).toBe("overPressureAcknowledged");
    expect(err.message).toMatch(/480 psig at 20 min/);
    const before = (await (await listTests(appRequest("/api/pressure-tests", { as: crew.technician }))).json()).items.length;

    const ok = await createTest(appRequest("/api/pressure-tests", post({ ...over, overPressureAcknowledged: true }, crew.technician)));
    expect(ok.status).toBe(201);
    const body = await ok.json();
    expect(body.test.verdict).toBe("stopped");
    expect(body.result.summary).toMatch(/^Stopped: above the rated test pressure/);
    expect(body.test.highestPressure).toBe(480);
    expect(body.test.highestAtSeconds).toBe(1200);
    expect(body.test.overPressureAcknowledgedById).toBe(crew.technician.userId);
    expect(body.test.overPressureAcknowledgedAt).toBeTruthy();
    const after = (await (await listTests(appRequest("/api/pressure-tests", { as: crew.technician }))).json()).items.length;
    // The refused attempt saved nothing.
    expect(after).toBe(before + 1);
    const read = await (await getTest(appRequest(`/api/pressure-tests/${body.test.id}`, { as: crew.lead }), routeParams({ id: body.test.id }))).json();
    expect(read.test.overPressureAcknowledgedAt).toBeTruthy();
  });

  it("stops a logger CSV whose peak is in the middle of the log (300 → 480 → 296 psig)", async () => {
    const csvText = "elapsed_min,pressure (psig),temp °F\n0,300,80\n15,480,79\n30,300,75\n60,294,70\n";
    const refused = await createTest(appRequest("/api/pressure-tests", post({ source: "file", csvText, temperatureUnit: "F", ratedTestPressureGauge: 450 }, crew.technician)));
    expect(refused.status).toBe(400);
    const ok = await createTest(appRequest("/api/pressure-tests", post({ source: "file", csvText, temperatureUnit: "F", ratedTestPressureGauge: 450, overPressureAcknowledged: true }, crew.technician)));
    const body = await ok.json();
    expect(body.test.verdict).toBe("stopped");
    expect(body.result.highest).toMatchObject({ pressureGauge: 480, atSeconds: 900, line: 3 });
  });

  it("the database refuses a stopped record without an acknowledgement (data-layer check)", async () => {
    await expect(
      createPressureTest(db(), {
        organizationId: crew.technician.organizationId,
        createdById: crew.technician.userId,
        title: "no acknowledgement",
        source: "typed",
        unit: "psig",
        temperatureUnit: "F",
        startPressure: 500,
        startTemperature: 70,
        endPressure: 500,
        endTemperature: 70,
        atmosphereAbs: 14.696,
        verdict: "stopped",
        result: {} as never,
      }),
    ).rejects.toThrow();
  });

  it("asks for gauge or absolute on a bare 'Pressure (kPa)' header (422 naming the column) and reads the answer", async () => {
    const csvText = "seconds,Pressure (kPa),temp C\n0,1900,20\n600,2050,20\n1200,1899,20\n";
    const bad = await createTest(appRequest("/api/pressure-tests", post({ source: "file", csvText, temperatureUnit: "C", ratedTestPressureGauge: 2000 }, crew.technician)));
    expect(bad.status).toBe(422);
    const err = (await bad.json()).error;
    expect(err.details.column).toBe("Pressure (kPa)");
    const ok = await createTest(appRequest("/api/pressure-tests", post({ source: "file", csvText, temperatureUnit: "C", ratedTestPressureGauge: 2000, ambiguousAs: "gauge", overPressureAcknowledged: true }, crew.technician)));
    const body = await ok.json();
    expect(body.test.verdict).toBe("stopped");
    expect(body.test.assumptions.join(" ")).toMatch(/as the technician chose/);
  });

  it("refuses 101.3 as the atmosphere of a psig test (400, says it looks like kPa) and computes it from the site's elevation (ISO 2533: 5,280 ft → 12.10 psia)", async () => {
    const bad = await createTest(appRequest("/api/pressure-tests", post(typed({ atmosphereAbs: 101.3 }), crew.technician)));
    expect(bad.status).toBe(400);
    expect((await bad.json()).error.message).toMatch(/looks like kPa abs/);
    const ok = await createTest(appRequest("/api/pressure-tests", post(typed({ siteElevation: { value: 5280, unit: "ft" } }), crew.technician)));
    expect(ok.status).toBe(201);
    const body = await ok.json();
    expect(body.test.atmosphereAbs).toBeCloseTo(12.1, 2);
    expect(body.test.atmosphereSource).toBe("elevation");
    expect(body.test.elevationM).toBeCloseTo(1609.344, 3);
    const both = await createTest(appRequest("/api/pressure-tests", post(typed({ siteElevation: { value: 100, unit: "m" }, atmosphereAbs: 14.6 }), crew.technician)));
    expect(both.status).toBe(400);
  });

  it("needs start and end time or a duration for typed readings (400 naming the field)", async () => {
    const res = await createTest(appRequest("/api/pressure-tests", post(typed({ durationMinutes: undefined }), crew.technician)));
    expect(res.status).toBe(400);
    expect((await res.json()).error.message).toMatch(/durationMinutes/);
    const backwards = await createTest(appRequest("/api/pressure-tests", post(typed({ durationMinutes: undefined, startedAt: "2026-05-01T10:00:00Z", endedAt: "2026-05-01T09:00:00Z" }), crew.technician)));
    expect(backwards.status).toBe(400);
  });
});
