import type { Metadata } from "next";
import Link from "next/link";
import { pageActor } from "@/lib/session";

export const metadata: Metadata = { title: "Tools" };

const TOOLS = [
  { href: "/tools/pressure-test", title: "Nitrogen pressure test", text: "Start and end readings with temperatures: is the drop a leak, or only the temperature?" },
  { href: "/tools/planner", title: "Pull-down planner", text: "How long the pump should take to reach the target, and what shorter, wider hoses or cores out would save." },
  { href: "/tools/rigs", title: "Rig and pump register", text: "Pumps, gauges, hoses and core tools; oil changes, blank-off tests and gauge checks, with reminders." },
  { href: "/tools/water", title: "Vacuum and water", text: "The temperature at which water boils or ice sits at a vacuum, and the vacuum a temperature needs." },
];

/** The Tools hub: the calculators and the rig register around the vacuum. */
export default async function ToolsPage() {
  await pageActor();
  return (
    <div className="mx-auto w-full max-w-3xl space-y-4 px-4 py-5 sm:py-8">
      <h1 className="text-headline">Tools</h1>
      <ul className="grid gap-3 sm:grid-cols-2">
        {TOOLS.map((t) => (
          <li key={t.href}>
            <Link
              href={t.href}
              className="block h-full rounded-card border border-surface-line bg-surface-raised p-4 shadow-card hover:border-tide-600 focus-visible:outline focus-visible:outline-2 focus-visible:outline-tide-600"
            >
              <span className="text-title text-fg">{t.title}</span>
              <span className="mt-1 block text-body text-fg-soft">{t.text}</span>
            </Link>
          </li>
        ))}
      </ul>
    </div>
  );
}
