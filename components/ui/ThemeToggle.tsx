"use client";

import { useSyncExternalStore } from "react";
import { cx } from "./cx";

export const THEME_KEY = "rl-theme";
export type Theme = "light" | "dark";

function applyTheme(theme: Theme) {
  document.documentElement.classList.toggle("dark", theme === "dark");
  try {
    localStorage.setItem(THEME_KEY, theme);
  } catch {
    /* private mode: the choice lasts for this page only */
  }
}

/** The theme is the `dark` class on <html>; watch it so every toggle on the page agrees. */
function subscribeToTheme(onChange: () => void) {
  const observer = new MutationObserver(onChange);
  observer.observe(document.documentElement, { attributes: true, attributeFilter: ["class"] });
  return () => observer.disconnect();
}

function readTheme(): Theme {
  return document.documentElement.classList.contains("dark") ? "dark" : "light";
}

/** Switches light/dark and remembers it in localStorage "rl-theme" (read before paint by app/layout.tsx). */
export function ThemeToggle({ className, showLabel = true }: { className?: string; showLabel?: boolean }) {
  const theme = useSyncExternalStore(subscribeToTheme, readTheme, () => null);
  const next: Theme = theme === "dark" ? "light" : "dark";
  const label = theme === "dark" ? "Light screen" : "Dark screen";
  return (
    <button
      type="button"
      data-testid="theme-toggle"
      aria-label={showLabel ? undefined : label}
      aria-pressed={theme === "dark"}
      onClick={() => {
        applyTheme(next);
      }}
      className={cx("inline-flex min-h-tap min-w-tap items-center justify-center gap-2 rounded-xl px-3 text-body text-fg hover:bg-surface-sunken", className)}
    >
      <span aria-hidden className="text-lead">{theme === "dark" ? "☀" : "☾"}</span>
      {showLabel && <span>{label}</span>}
    </button>
  );
}
