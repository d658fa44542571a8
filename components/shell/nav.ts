import { can, type Role } from "@/lib/permissions";
import type { IconName } from "./icons";

export interface NavItem {
  href: string;
  label: string;
  icon: IconName;
  /** The one call to action, drawn larger. */
  prominent?: boolean;
}

/** The app's places, in order, for a role (Review only for those who sign tests off). */
export function navItemsFor(role: Role): NavItem[] {
  const items: NavItem[] = [
    { href: "/home", label: "Home", icon: "home" },
    { href: "/vacuum-tests", label: "Tests", icon: "tests" },
    { href: "/vacuum-tests/new", label: "New test", icon: "new", prominent: true },
  ];
  if (can(role, "tests.review")) items.push({ href: "/review", label: "Review", icon: "review" });
  items.push({ href: "/casebook", label: "Casebook", icon: "casebook" });
  if (role === "apprentice" || role === "trainer") items.push({ href: "/practice", label: "Practice", icon: "casebook" });
  if (can(role, "records.manage") || can(role, "tests.read_all")) items.push({ href: "/records", label: "Customers", icon: "customers" });
  items.push({ href: "/tools", label: "Tools", icon: "tools" });
  if (can(role, "profiles.manage")) items.push({ href: "/settings/profiles", label: "Acceptance", icon: "profile" });
  // Reviewers reach their own mail choices from the Mail page; everyone else has them here.
  items.push(can(role, "tests.review") ? { href: "/settings/mail", label: "Mail", icon: "mail" } : { href: "/settings/my-mail", label: "My mail", icon: "mail" });
  items.push({ href: "/settings/members", label: "Shop", icon: "shop" });
  return items;
}

/** True when `pathname` is inside `href` ("/vacuum-tests/123" is in Tests, but "/vacuum-tests/new" is not). */
export function isCurrent(pathname: string, href: string, all: NavItem[]): boolean {
  if (pathname === href) return true;
  if (!pathname.startsWith(href + "/")) return false;
  // A more specific item owns the path.
  return !all.some((i) => i.href !== href && i.href.startsWith(href + "/") && (pathname === i.href || pathname.startsWith(i.href + "/")));
}

/** On a phone the bar holds four places and "More"; the rest live in the sheet. */
export function splitForPhone(items: NavItem[]): { bar: NavItem[]; sheet: NavItem[] } {
  const barHrefs = ["/home", "/vacuum-tests", "/vacuum-tests/new", items.some((i) => i.href === "/review") ? "/review" : "/casebook"];
  return { bar: barHrefs.map((h) => items.find((i) => i.href === h)!), sheet: items.filter((i) => !barHrefs.includes(i.href)) };
}
