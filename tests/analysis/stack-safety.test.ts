/**
 * Data-sized arrays never go through the call stack: no argument spreading (`Math.min(...readings)`,
 * `push(...rows)`, `f.apply(null, rows)`) and no recursion anywhere in the engine (analysis/) or the API
 * routes (app/api/), because V8 puts every spread argument on the stack and a 1,000,000-row log
 * overflows it ("Maximum call stack size exceeded"; V8's limit, engine behaviour, no published source).
 * The lint rule in scripts/eslint.config.mjs flags spreads as they are written; this test also finds
 * functions that call themselves.
 */
import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import ts from "typescript";
import { describe, expect, it } from "vitest";

const root = path.resolve(import.meta.dirname, "../..");

function sourceFiles(dir: string): string[] {
  const out: string[] = [];
  for (const name of readdirSync(dir)) {
    const full = path.join(dir, name);
    if (statSync(full).isDirectory()) out.push(...sourceFiles(full));
    else if (/\.tsx?$/.test(name) && !name.endsWith(".d.ts")) out.push(full);
  }
  return out;
}

interface Problem {
  file: string;
  line: number;
  what: string;
}

function problemsIn(file: string): Problem[] {
  const text = readFileSync(file, "utf8");
  const sf = ts.createSourceFile(file, text, ts.ScriptTarget.Latest, true, file.endsWith(".tsx") ? ts.ScriptKind.TSX : ts.ScriptKind.TS);
  const out: Problem[] = [];
  const where = (n: ts.Node) => sf.getLineAndCharacterOfPosition(n.getStart(sf)).line + 1;
  const rel = path.relative(root, file);
  // names of the functions enclosing the current node, innermost last
  const enclosing: string[] = [];
  const visit = (node: ts.Node) => {
    let name: string | null = null;
    if ((ts.isFunctionDeclaration(node) || ts.isMethodDeclaration(node)) && node.name && ts.isIdentifier(node.name)) name = node.name.text;
    else if ((ts.isArrowFunction(node) || ts.isFunctionExpression(node)) && ts.isVariableDeclaration(node.parent) && ts.isIdentifier(node.parent.name)) name = node.parent.name.text;
    if (ts.isCallExpression(node) || ts.isNewExpression(node)) {
      for (const arg of node.arguments ?? []) if (ts.isSpreadElement(arg)) out.push({ file: rel, line: where(arg), what: `argument spread '${arg.getText(sf).slice(0, 40)}'` });
      const callee = node.expression;
      if (ts.isPropertyAccessExpression(callee) && callee.name.text === "apply" && (node.arguments?.length ?? 0) >= 2) out.push({ file: rel, line: where(node), what: "Function.prototype.apply with an argument array" });
      const calleeName = ts.isIdentifier(callee) ? callee.text : ts.isPropertyAccessExpression(callee) && callee.expression.kind === ts.SyntaxKind.ThisKeyword ? callee.name.text : null;
      if (calleeName !== null && enclosing.length > 0 && enclosing[enclosing.length - 1] === calleeName) out.push({ file: rel, line: where(node), what: `recursion: '${calleeName}' calls itself` });
    }
    if (name !== null) enclosing.push(name);
    ts.forEachChild(node, visit);
    if (name !== null) enclosing.pop();
  };
  visit(sf);
  return out;
}

describe("no data-sized arrays through the call stack (V8 call-stack limit; engine behaviour, no published source)", () => {
  const files = [...sourceFiles(path.join(root, "analysis")), ...sourceFiles(path.join(root, "app/api")), ...sourceFiles(path.join(root, "lib/vacuum-tests"))];

  it("scans the engine, the API routes and the upload path", () => {
    expect(files.length).toBeGreaterThan(60);
    expect(files.some((f) => f.endsWith(path.join("app", "api", "rigs", "[id]", "events", "route.ts")))).toBe(true);
  });

  it("finds no argument spreading and no recursion", () => {
    const problems = files.flatMap(problemsIn);
    expect(problems.map((p) => `${p.file}:${p.line}: ${p.what}`)).toEqual([]);
  });

  it("the check itself sees a spread, an apply and a self-call (so an empty list means something)", () => {
    const dir = path.join(root, "fixtures", "stack-safety");
    const found = problemsIn(path.join(dir, "bad-example.ts")).map((p) => p.what.split(" ")[0]);
    expect(found).toEqual(expect.arrayContaining(["argument", "Function.prototype.apply", "recursion:"]));
  });
});
