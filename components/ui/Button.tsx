import Link from "next/link";
import type { ButtonHTMLAttributes, ComponentProps } from "react";
import { cx } from "./cx";
import { Spinner } from "./Spinner";

export type ButtonVariant = "primary" | "secondary" | "quiet" | "danger" | "attention";
export type ButtonSize = "md" | "lg";

const base =
  "inline-flex items-center justify-center gap-2 rounded-xl font-medium select-none transition-colors " +
  "disabled:cursor-not-allowed disabled:opacity-55 aria-disabled:cursor-not-allowed aria-disabled:opacity-55";

const variants: Record<ButtonVariant, string> = {
  primary: "bg-tide-600 text-white hover:bg-tide-700 active:bg-tide-800 dark:bg-tide-300 dark:text-tide-900 dark:hover:bg-tide-200",
  secondary:
    "border-2 border-tide-600 text-tide-700 bg-surface-raised hover:bg-tide-50 dark:border-tide-300 dark:text-tide-200 dark:hover:bg-tide-900",
  quiet: "text-fg hover:bg-surface-sunken",
  danger: "bg-verdict-leak text-white hover:brightness-110",
  attention: "bg-flare-500 text-ink hover:bg-flare-300",
};

const sizes: Record<ButtonSize, string> = {
  md: "min-h-tap px-4 text-body",
  lg: "min-h-14 px-6 text-lead",
};

export function buttonClasses(opts: { variant?: ButtonVariant; size?: ButtonSize; block?: boolean; className?: string } = {}) {
  return cx(base, variants[opts.variant ?? "primary"], sizes[opts.size ?? "md"], opts.block && "w-full", opts.className);
}

export interface ButtonProps extends ButtonHTMLAttributes<HTMLButtonElement> {
  variant?: ButtonVariant;
  size?: ButtonSize;
  /** Full width. */
  block?: boolean;
  /** Shows a spinner and disables the button while an action runs. */
  busy?: boolean;
}

/** A button at least 48 px tall. `type` defaults to "button" so forms never submit by accident. */
export function Button({ variant, size, block, busy, className, children, disabled, type = "button", ...rest }: ButtonProps) {
  return (
    <button
      type={type}
      className={buttonClasses({ variant, size, block, className })}
      disabled={disabled || busy}
      aria-busy={busy || undefined}
      {...rest}
    >
      {busy && <Spinner size="sm" label="" />}
      {children}
    </button>
  );
}

export interface LinkButtonProps extends ComponentProps<typeof Link> {
  variant?: ButtonVariant;
  size?: ButtonSize;
  block?: boolean;
}

/** A link that looks like a button (navigation, not actions). */
export function LinkButton({ variant, size, block, className, ...rest }: LinkButtonProps) {
  return <Link className={buttonClasses({ variant, size, block, className })} {...rest} />;
}
