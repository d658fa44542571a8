import Link from "next/link";
import type { ReactNode } from "react";
import { ThemeToggle } from "@/components/ui/ThemeToggle";
import { Wordmark } from "./Mark";

/** The frame of the sign-in, sign-up and invitation pages: the name, one card, a footer. */
export function AuthFrame({ title, intro, children, footer }: { title: string; intro?: ReactNode; children: ReactNode; footer?: ReactNode }) {
  return (
    <div className="flex min-h-dvh flex-col">
      <header className="flex items-center justify-between px-4 py-3 sm:px-6">
        <Link href="/" className="rounded-lg" aria-label="Riseline home">
          <Wordmark />
        </Link>
        <ThemeToggle showLabel={false} />
      </header>
      <main className="mx-auto flex w-full max-w-md flex-1 flex-col px-4 pb-10 pt-4 sm:pt-10">
        <h1 className="text-headline text-fg">{title}</h1>
        {intro && <div className="mt-2 text-lead text-fg-soft">{intro}</div>}
        <div className="mt-6 rounded-card border border-surface-line bg-surface-raised p-5 shadow-card">{children}</div>
        {footer && <div className="mt-6 flex flex-col gap-3 text-body text-fg-soft">{footer}</div>}
      </main>
    </div>
  );
}

/** A text link in our colours with a tap-sized hit area. */
export function TextLink({ href, children, className }: { href: string; children: ReactNode; className?: string }) {
  return (
    <Link href={href} className={"inline-flex min-h-tap items-center font-medium text-tide-700 underline underline-offset-4 hover:text-tide-900 dark:text-tide-300 dark:hover:text-tide-100 " + (className ?? "")}>
      {children}
    </Link>
  );
}
