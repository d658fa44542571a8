// Lint rules for the whole project (run from the project root: `npm run lint`).
import nextVitals from "eslint-config-next/core-web-vitals";
import nextTs from "eslint-config-next/typescript";

const config = [
  ...nextVitals,
  ...nextTs,
  {
    ignores: [".next/**", "node_modules/**", ".data/**", "db/migrations/**", "next-env.d.ts", "coverage/**", "public/sw.js"],
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
  {
    // Data-sized arrays never go through the call stack: a million readings spread as arguments overflow it
    // (tests/analysis/stack-safety.test.ts also finds recursion).
    files: ["analysis/**/*.ts", "app/api/**/*.ts", "lib/vacuum-tests/**/*.ts"],
    rules: {
      "no-restricted-syntax": [
        "error",
        { selector: "CallExpression > SpreadElement", message: "No argument spreading here: loop over the array (a log's readings overflow the call stack)." },
        { selector: "NewExpression > SpreadElement", message: "No argument spreading here: loop over the array (a log's readings overflow the call stack)." },
        { selector: "CallExpression[callee.property.name='apply'][arguments.length=2]", message: "No Function.prototype.apply with an argument array: loop over it." },
      ],
    },
  },
];

export default config;
