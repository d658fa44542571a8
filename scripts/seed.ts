// Seeds the demo shop once: an invented company, one user per role, a default acceptance
// profile and a month of tests. Running it again changes nothing.
import { eq } from "drizzle-orm";
import { db, closeDb } from "@/db/client";
import { closeMail } from "@/lib/mail";
import { organization, acceptanceProfiles } from "@/db/schema";
import { getAuth } from "@/lib/auth";
import type { Role } from "@/lib/permissions";
import { DEMO_COMPANY, DEMO_PEOPLE } from "./demo-people";

async function main() {
  const [existing] = await db().select().from(organization).where(eq(organization.slug, DEMO_COMPANY.slug)).limit(1);
  if (existing) {
    console.log(`• Demo shop "${DEMO_COMPANY.name}" already seeded; reusing its data.`);
    printPeople();
    return;
  }
  const auth = getAuth();
  const people: { userId: string; role: Role; name: string }[] = [];
  for (const p of DEMO_PEOPLE) {
    const { user } = await auth.api.signUpEmail({ body: { email: p.email, password: p.password, name: p.name } });
    people.push({ userId: user.id, role: p.role, name: p.name });
  }
  const owner = people.find((p) => p.role === "owner")!;
  const org = await auth.api.createOrganization({
    body: { name: DEMO_COMPANY.name, slug: DEMO_COMPANY.slug, userId: owner.userId },
  });
  if (!org) throw new Error("could not create the demo organization");
  for (const p of people) {
    if (p.role !== "owner") await auth.api.addMember({ body: { userId: p.userId, organizationId: org.id, role: p.role } });
  }
  await db().insert(acceptanceProfiles).values([
    { organizationId: org.id, name: "Shop standard", targetMicrons: 500, holdMinutes: 10, limitMicrons: 1000, leakRateMicronsPerMinute: 10, isDefault: true },
    { organizationId: org.id, name: "Strict (new installs, A2L)", targetMicrons: 300, holdMinutes: 15, limitMicrons: 500, leakRateMicronsPerMinute: 5, isDefault: false },
  ]);
  // The invented demo shop keeps Central time: its reports and e-mails write times in it.
  const { upsertOrganizationTimeZone } = await import("@/db/queries/settings");
  await upsertOrganizationTimeZone(db(), { organizationId: org.id, timeZone: "America/Chicago" });
  const { seedDemoTests } = await import("./seed-tests");
  const { created: count } = await seedDemoTests(db(), { organizationId: org.id, members: people });
  // After the month of tests: seedDemoTests skips an organization that already has tests.
  const { seedStarterCasebook } = await import("./seed-casebook");
  const trainer = people.find((p) => p.role === "trainer")!;
  const casebook = await seedStarterCasebook(db(), { organizationId: org.id, trainerId: trainer.userId });
  console.log(`• Seeded "${DEMO_COMPANY.name}" with ${people.length} people, ${count} tests and a starter casebook of ${casebook.created} simulated curves.`);
  printPeople();
}

function printPeople() {
  console.log("\n  Demo sign-ins (invented people; local demo only):");
  for (const p of DEMO_PEOPLE) console.log(`    ${p.role.padEnd(11)} ${p.email.padEnd(34)} ${p.password}`);
  console.log("");
}

// The leads' e-mail of the seeded tests waits in the job queue for the app (or a worker) to send it.
main()
  .then(() => closeMail())
  .then(() => closeDb())
  .catch(async (err) => {
    console.error(err);
    await closeDb();
    process.exit(1);
  });
