// Lint rules for the whole project (run from the project root: `npm run lint`).
import nextVitals from "eslint-config-next/core-web-vitals";
import nextTs from "eslint-config-next/typescript";

const config = [
  ...nextVitals,
  ...nextTs,
  {
    ignores: [".next/**", "node_modules/**", ".data/**", "db/migrations/**", "next-env.d.ts", "coverage/**"],
  },
  {
    rules: {
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_" }],
    },
  },
  {
    // The analysis engine stays pure: no UI, no database, no environment.
    files: ["analysis/**/*.ts"],
    ignores: ["analysis/cli.ts"],
    rules: {
      "no-restricted-imports": [
        "error",
        { patterns: ["react", "react-dom", "next/*", "@/db/*", "@/lib/*", "pg", "node:fs", "fs"] },
      ],
      "no-restricted-properties": ["error", { object: "process", property: "env", message: "analysis/ is pure: pass options in." }],
    },
  },
];

export default config;
