"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";
import { useEffect, useRef, type ReactNode } from "react";
import { cx } from "@/components/ui/cx";
import { ThemeToggle } from "@/components/ui/ThemeToggle";
import { ROLE_LABELS, type Role } from "@/lib/permissions";
import { Icon } from "./icons";
import { Mark, Wordmark } from "./Mark";
import { isCurrent, navItemsFor, splitForPhone, type NavItem } from "./nav";
import { SignOutButton } from "./SignOutButton";

export interface AppShellProps {
  shopName: string;
  memberName: string;
  role: Role;
  children: ReactNode;
}

/**
 * The frame around every signed-in page: a bottom bar on phones, a sidebar from 1024 px.
 * Find parts by data-testid: app-shell, bottom-nav, sidebar, more-button, more-sheet,
 * shop-name, member-name, member-role (the last three exist in the phone header and the sidebar:
 * filter by visibility).
 */
export function AppShell({ shopName, memberName, role, children }: AppShellProps) {
  const pathname = usePathname() ?? "/";
  const items = navItemsFor(role);
  const { bar, sheet } = splitForPhone(items);
  const sheetRef = useRef<HTMLDialogElement>(null);
  const roleLabel = ROLE_LABELS[role];

  useEffect(() => {
    sheetRef.current?.close();
  }, [pathname]);

  return (
    <div data-testid="app-shell" className="min-h-dvh">
      <a href="#main" className="sr-only focus:not-sr-only focus:fixed focus:left-3 focus:top-3 focus:z-50 focus:rounded-lg focus:bg-surface-raised focus:px-4 focus:py-3">
        Skip to the page
      </a>

      {/* Desktop sidebar */}
      <aside data-testid="sidebar" className="fixed inset-y-0 left-0 z-30 hidden w-64 flex-col border-r border-surface-line bg-surface-raised lg:flex">
        <div className="px-5 pt-5">
          <Link href="/home" className="rounded-lg" aria-label="Riseline, home">
            <Wordmark />
          </Link>
          <p data-testid="shop-name" className="mt-3 truncate text-body font-semibold text-fg" title={shopName}>
            {shopName}
          </p>
        </div>
        <nav aria-label="Main" className="mt-4 flex-1 overflow-y-auto px-3">
          <ul className="flex flex-col gap-1">
            {items.map((item) => (
              <li key={item.href}>
                <SideLink item={item} current={isCurrent(pathname, item.href, items)} />
              </li>
            ))}
          </ul>
        </nav>
        <div className="border-t border-surface-line px-3 py-3">
          <MemberLine name={memberName} roleLabel={roleLabel} className="px-3 pb-2" />
          <ThemeToggle className="w-full justify-start" />
          <SignOutButton className="w-full" />
        </div>
      </aside>

      {/* Phone header */}
      <header className="sticky top-0 z-20 flex items-center justify-between gap-3 border-b border-surface-line bg-surface-raised/95 px-4 py-2 backdrop-blur lg:hidden">
        <Link href="/home" className="flex shrink-0 items-center gap-2 rounded-lg" aria-label="Riseline, home">
          <Mark size={30} />
          <span className="text-lead font-semibold tracking-tight text-fg">Riseline</span>
        </Link>
        <div className="min-w-0 text-right">
          <p data-testid="shop-name" className="truncate text-caption font-semibold text-fg" title={shopName}>
            {shopName}
          </p>
          <p className="truncate text-caption text-fg-soft">
            <span data-testid="member-name">{memberName}</span> · <span data-testid="member-role">{roleLabel}</span>
          </p>
        </div>
      </header>

      <main id="main" className="pb-28 lg:pb-0 lg:pl-64">
        <div className="mx-auto w-full max-w-5xl px-4 py-5 sm:px-6 lg:py-8">{children}</div>
      </main>

      {/* Phone bottom bar */}
      <nav aria-label="Main" data-testid="bottom-nav" className="fixed inset-x-0 bottom-0 z-30 border-t border-surface-line bg-surface-raised pb-[env(safe-area-inset-bottom)] lg:hidden">
        <ul className="flex items-stretch">
          {bar.map((item) => (
            <li key={item.href} className="flex-1">
              <BarLink item={item} current={isCurrent(pathname, item.href, items)} />
            </li>
          ))}
          <li className="flex-1">
            <button
              type="button"
              data-testid="more-button"
              aria-haspopup="dialog"
              onClick={() => sheetRef.current?.showModal()}
              className={cx(barItem, sheet.some((i) => isCurrent(pathname, i.href, items)) ? barCurrent : "text-fg-soft")}
            >
              <Icon name="more" />
              <span>More</span>
            </button>
          </li>
        </ul>
      </nav>

      <dialog
        ref={sheetRef}
        data-testid="more-sheet"
        aria-label="More places"
        className="fixed inset-x-0 bottom-0 top-auto m-0 w-full max-w-none rounded-t-2xl border-t border-surface-line bg-surface-raised p-0 text-fg backdrop:bg-black/50 lg:hidden"
        onClick={(e) => {
          if (e.target === e.currentTarget) sheetRef.current?.close();
        }}
      >
        <div className="px-4 pb-[calc(1rem+env(safe-area-inset-bottom))] pt-3">
          <div className="flex items-center justify-between">
            <MemberLine name={memberName} roleLabel={roleLabel} />
            <button type="button" onClick={() => sheetRef.current?.close()} className="inline-flex min-h-tap min-w-tap items-center justify-center rounded-xl hover:bg-surface-sunken" aria-label="Close">
              <Icon name="close" />
            </button>
          </div>
          <ul className="mt-2 flex flex-col gap-1">
            {sheet.map((item) => (
              <li key={item.href}>
                <SideLink item={item} current={isCurrent(pathname, item.href, items)} onNavigate={() => sheetRef.current?.close()} />
              </li>
            ))}
          </ul>
          <div className="mt-2 flex flex-col border-t border-surface-line pt-2">
            <ThemeToggle className="justify-start" />
            <SignOutButton />
          </div>
        </div>
      </dialog>
    </div>
  );
}

function MemberLine({ name, roleLabel, className }: { name: string; roleLabel: string; className?: string }) {
  return (
    <div className={cx("min-w-0", className)}>
      <p data-testid="member-name" className="truncate text-body font-medium text-fg">
        {name}
      </p>
      <p data-testid="member-role" className="text-caption text-fg-soft">
        {roleLabel}
      </p>
    </div>
  );
}

const barItem = "flex min-h-16 w-full flex-col items-center justify-center gap-0.5 px-1 text-caption font-medium";
const barCurrent = "text-tide-700 dark:text-tide-300";

function BarLink({ item, current }: { item: NavItem; current: boolean }) {
  if (item.prominent) {
    return (
      <Link href={item.href} aria-current={current ? "page" : undefined} className={cx(barItem, "text-fg")}>
        <span className={cx("-mt-5 inline-flex h-12 w-12 items-center justify-center rounded-full bg-flare-500 text-ink shadow-card ring-4 ring-surface-raised", current && "bg-flare-300")}>
          <Icon name={item.icon} />
        </span>
        <span>{item.label}</span>
      </Link>
    );
  }
  return (
    <Link href={item.href} aria-current={current ? "page" : undefined} className={cx(barItem, current ? barCurrent : "text-fg-soft")}>
      <span className={cx("inline-flex h-8 w-12 items-center justify-center rounded-full", current && "bg-tide-100 dark:bg-tide-900")}>
        <Icon name={item.icon} />
      </span>
      <span>{item.label}</span>
    </Link>
  );
}

function SideLink({ item, current, onNavigate }: { item: NavItem; current: boolean; onNavigate?: () => void }) {
  if (item.prominent) {
    return (
      <Link href={item.href} onClick={onNavigate} aria-current={current ? "page" : undefined} className="my-2 flex min-h-tap items-center gap-3 rounded-xl bg-flare-500 px-3 font-semibold text-ink hover:bg-flare-300">
        <Icon name={item.icon} />
        {item.label}
      </Link>
    );
  }
  return (
    <Link
      href={item.href}
      onClick={onNavigate}
      aria-current={current ? "page" : undefined}
      className={cx(
        "flex min-h-tap items-center gap-3 rounded-xl px-3 text-body",
        current ? "bg-tide-600 font-semibold text-white dark:bg-tide-700" : "text-fg hover:bg-surface-sunken",
      )}
    >
      <Icon name={item.icon} />
      {item.label}
    </Link>
  );
}
