import { AppShell } from "@/components/shell/AppShell";
import { db } from "@/db/client";
import { pageActor } from "@/lib/session";
import { UnitsProvider } from "@/lib/units/context";
import { unitSettingsOf } from "@/lib/units/settings";

/** Every page inside (app) needs a signed-in member of a shop; pageActor redirects otherwise. */
export default async function AppLayout({ children }: { children: React.ReactNode }) {
  const actor = await pageActor();
  const units = await unitSettingsOf(db(), actor);
  return (
    <AppShell shopName={actor.organizationName} memberName={actor.name} role={actor.role}>
      <UnitsProvider system={units.effective}>{children}</UnitsProvider>
    </AppShell>
  );
}
