import type { Config } from "tailwindcss";

/**
 * Riseline's look: a deep "tide" teal for the brand, warm "flare" amber for attention,
 * calm surfaces that flip for the dark theme (CSS variables in app/globals.css), and a
 * verdict palette that never relies on colour alone (each verdict also has an icon and words).
 */
const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        tide: {
          50: "#eefaf8", 100: "#d3f1ec", 200: "#a8e2d9", 300: "#72cbbf", 400: "#3faea1",
          500: "#1f9185", 600: "#0b6e69", 700: "#0a5a57", 800: "#0c4846", 900: "#0d3b3a",
        },
        flare: { 100: "#fdf0d2", 300: "#f7cd6b", 500: "#e8a317", 700: "#a86d05" },
        ink: { DEFAULT: "#14232b", soft: "#50616b", faint: "#8a99a2" },
        surface: {
          DEFAULT: "var(--rl-surface)",
          raised: "var(--rl-surface-raised)",
          sunken: "var(--rl-surface-sunken)",
          line: "var(--rl-line)",
        },
        fg: { DEFAULT: "var(--rl-fg)", soft: "var(--rl-fg-soft)", faint: "var(--rl-fg-faint)" },
        verdict: {
          pass: "#1d7f4e",
          leak: "#c2410c",
          moisture: "#2563a8",
          both: "#8a3fb8",
          unsure: "#5f6f78",
        },
      },
      fontFamily: {
        sans: ['"IBM Plex Sans"', "system-ui", "sans-serif"],
      },
      fontSize: {
        caption: ["0.8125rem", { lineHeight: "1.15rem" }],
        body: ["1rem", { lineHeight: "1.55rem" }],
        lead: ["1.125rem", { lineHeight: "1.7rem" }],
        title: ["1.375rem", { lineHeight: "1.8rem", fontWeight: "600" }],
        headline: ["1.75rem", { lineHeight: "2.2rem", fontWeight: "600" }],
        figure: ["2.25rem", { lineHeight: "2.5rem", fontWeight: "600" }],
      },
      borderRadius: { card: "0.875rem" },
      minHeight: { tap: "3rem" },
      minWidth: { tap: "3rem" },
      boxShadow: { card: "0 1px 2px rgba(20,35,43,.06), 0 4px 16px rgba(20,35,43,.06)" },
    },
  },
};

export default config;
