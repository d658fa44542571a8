import { describe, expect, it } from "vitest";
import { GET as commentsGet, POST as commentsPost } from "@/app/api/vacuum-tests/[id]/comments/route";
import { GET as eventsGet } from "@/app/api/vacuum-tests/[id]/events/route";
import { appRequest, createShop, routeParams, type TestMember } from "./helpers/members";
import { jsonInit, crewForFile } from "./helpers/crew";
import { seedTest } from "./helpers/seed-test";

const post = (id: string, as: TestMember, body: unknown) =>
  commentsPost(appRequest(`/api/vacuum-tests/${id}/comments`, jsonInit(as, body)), routeParams({ id }));

const crew = crewForFile();

describe("comments on a test (tests.comment: everyone on tests they can see, DEVELOPERS.md)", () => {
  it("stores a comment at a time on the curve and one about the whole test, oldest first, in the audit trail too", async () => {
    const id = await seedTest(crew.technician);
    const a = await post(id, crew.lead, { body: "See the jump here — a hose?", atSeconds: 1500 });
    expect(a.status).toBe(201);
    expect((await a.json()).comment).toMatchObject({ atSeconds: 1500, authorName: crew.lead.name });
    expect((await post(id, crew.technician, { body: "Will re-check the core tool." })).status).toBe(201);
    const { comments } = await (await commentsGet(appRequest(`/api/vacuum-tests/${id}/comments`, { as: crew.technician }), routeParams({ id }))).json();
    expect(comments.map((c: { body: string; atSeconds: number | null }) => [c.body, c.atSeconds])).toEqual([
      ["See the jump here — a hose?", 1500],
      ["Will re-check the core tool.", null],
    ]);
    const { events } = await (await eventsGet(appRequest(`/api/vacuum-tests/${id}/events`, { as: crew.lead }), routeParams({ id }))).json();
    expect(events.filter((e: { kind: string }) => e.kind === "commented")).toHaveLength(2);
    expect(events[0].note).toContain("(at 25.0 min)");
  });

  it("a trainer can comment on any test; an apprentice cannot see another's test → 404", async () => {
    const id = await seedTest(crew.technician);
    expect((await post(id, crew.trainer, { body: "Good hold." })).status).toBe(201);
    expect((await post(id, crew.apprentice, { body: "?" })).status).toBe(404);
    expect((await commentsGet(appRequest(`/api/vacuum-tests/${id}/comments`, { as: crew.apprentice }), routeParams({ id }))).status).toBe(404);
  });

  it("rejects an empty body and a negative time (400) and another shop (404)", async () => {
    const id = await seedTest(crew.technician);
    expect((await post(id, crew.lead, { body: "   " })).status).toBe(400);
    expect((await post(id, crew.lead, { body: "x", atSeconds: -5 })).status).toBe(400);
    const stranger = await createShop();
    expect((await post(id, stranger, { body: "hello" })).status).toBe(404);
    expect((await commentsGet(appRequest(`/api/vacuum-tests/${id}/comments`), routeParams({ id }))).status).toBe(401);
  });
});
