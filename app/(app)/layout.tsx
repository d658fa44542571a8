import { AppShell } from "@/components/shell/AppShell";
import { pageActor } from "@/lib/session";

/** Every page inside (app) needs a signed-in member of a shop; pageActor redirects otherwise. */
export default async function AppLayout({ children }: { children: React.ReactNode }) {
  const actor = await pageActor();
  return (
    <AppShell shopName={actor.organizationName} memberName={actor.name} role={actor.role}>
      {children}
    </AppShell>
  );
}
