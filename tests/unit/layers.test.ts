import fs from "node:fs";
import path from "node:path";
import ts from "typescript";
import { describe, expect, it } from "vitest";

/**
 * The layers DEVELOPERS.md describes ("Layers"), checked over every import of the application's
 * own source. A failure names each file and the import that crosses a layer.
 */

const ROOT = path.resolve(__dirname, "../..");
const SOURCE_FOLDERS = ["app", "components", "lib", "db", "jobs", "scripts"];
const SOURCE_FILES = ["instrumentation.ts", "proxy.ts"];

/** Pure computation: anything here must run in a test, a script or a browser without a server. */
const PURE = [
  "lib/mechanics/",
  "lib/limits/",
  "lib/fatigue/",
  "lib/series/",
  "lib/dynamic/",
  "lib/ingest/",
  "lib/report/",
  "lib/demo/",
  "lib/alerting/",
  "lib/gauges/",
  "lib/files/",
  "lib/thermal/",
  "lib/load-tests/",
  "lib/field-records/",
  "lib/units.ts",
  "lib/errors.ts",
  "lib/time-format.ts",
];
const SERVER_SIDE = ["db/", "lib/services/", "lib/api/", "lib/auth/", "lib/mail/", "lib/storage/", "lib/actions/", "jobs/", "app/", "components/"];
const FRAMEWORKS = ["next", "next-auth", "react", "react-dom", "drizzle-orm", "@libsql/client", "libsql", "nodemailer"];

/** Row types and the API's response shapes are vocabulary, not behaviour: pure modules and services may name them in `import type`. */
const TYPE_VOCABULARY = [/^db\/schema\.ts$/, /^lib\/api\/[\w-]*schemas?\.ts$/];

type Import = { file: string; specifier: string; target: string | null; typeOnly: boolean };
type Rule = { name: string; from: (file: string) => boolean; forbids: (imported: Import) => boolean };

const under = (prefixes: string[]) => (file: string) => prefixes.some((prefix) => (prefix.endsWith("/") ? file.startsWith(prefix) : file === prefix));
const isPackage = (imported: Import, names: string[]) =>
  imported.target === null && names.some((name) => imported.specifier === name || imported.specifier.startsWith(`${name}/`));
const targetUnder = (imported: Import, prefixes: string[]) => imported.target !== null && under(prefixes)(imported.target);
const typeVocabulary = (imported: Import) => imported.typeOnly && imported.target !== null && TYPE_VOCABULARY.some((pattern) => pattern.test(imported.target!));

const RULES: Rule[] = [
  {
    name: "a pure lib module imports no database, service, API, auth, mail, framework or UI code",
    from: under(PURE),
    forbids: (imported) => !typeVocabulary(imported) && (targetUnder(imported, SERVER_SIDE) || isPackage(imported, FRAMEWORKS)),
  },
  {
    name: "lib/services does not import lib/api, server actions, pages or components",
    from: under(["lib/services/"]),
    forbids: (imported) => !typeVocabulary(imported) && targetUnder(imported, ["lib/api/", "lib/actions/", "app/", "components/"]),
  },
  { name: "components do not import app/ or the database", from: under(["components/"]), forbids: (imported) => !typeVocabulary(imported) && targetUnder(imported, ["app/", "db/"]) },
  { name: "db/ does not import services, the API, actions, pages or components", from: under(["db/"]), forbids: (imported) => targetUnder(imported, ["lib/services/", "lib/api/", "lib/actions/", "app/", "components/"]) },
];

/**
 * Known exceptions, each with the reason it stays. Keep this list short; a new entry needs a
 * reason a reviewer would accept.
 */
const ALLOWED: { file: string; targetsUnder: string; why: string }[] = [
  {
    file: "db/seed.ts",
    targetsUnder: "lib/services/",
    why:
      "the demo seed builds its story through the services, as a user would, so it obeys their validation and audit; " +
      "the demo-logger job and the browser tests import its constants, so it moves to scripts/ once those constants have a module of their own",
  },
];

function sourceFiles(): string[] {
  const files: string[] = SOURCE_FILES.filter((file) => fs.existsSync(path.join(ROOT, file)));
  const visit = (folder: string) => {
    for (const entry of fs.readdirSync(path.join(ROOT, folder), { withFileTypes: true })) {
      const relative = `${folder}/${entry.name}`;
      if (entry.isDirectory()) visit(relative);
      else if (/\.tsx?$/.test(entry.name) && !entry.name.endsWith(".d.ts")) files.push(relative);
    }
  };
  for (const folder of SOURCE_FOLDERS) if (fs.existsSync(path.join(ROOT, folder))) visit(folder);
  return files;
}

/** A specifier as a repository path (with its extension), or null for a package. */
function resolve(file: string, specifier: string): string | null {
  let base: string;
  if (specifier.startsWith("@/")) base = specifier.slice(2);
  else if (specifier.startsWith(".")) base = path.posix.normalize(path.posix.join(path.posix.dirname(file), specifier));
  else return null;
  for (const candidate of [base, `${base}.ts`, `${base}.tsx`, `${base}/index.ts`, `${base}/index.tsx`]) {
    if (fs.existsSync(path.join(ROOT, candidate)) && fs.statSync(path.join(ROOT, candidate)).isFile()) return candidate;
  }
  return base;
}

function importsOf(file: string): Import[] {
  const text = fs.readFileSync(path.join(ROOT, file), "utf8");
  const source = ts.createSourceFile(file, text, ts.ScriptTarget.Latest, false, file.endsWith(".tsx") ? ts.ScriptKind.TSX : ts.ScriptKind.TS);
  const found: Import[] = [];
  const add = (specifier: string, typeOnly: boolean) => found.push({ file, specifier, target: resolve(file, specifier), typeOnly });
  const visit = (node: ts.Node) => {
    if (ts.isImportDeclaration(node) && ts.isStringLiteral(node.moduleSpecifier)) {
      const clause = node.importClause;
      const named = clause?.namedBindings && ts.isNamedImports(clause.namedBindings) ? clause.namedBindings.elements : null;
      const allNamedTypes = !!named && named.length > 0 && !clause?.name && named.every((element) => element.isTypeOnly);
      add(node.moduleSpecifier.text, !!clause && (clause.isTypeOnly || allNamedTypes));
    } else if (ts.isExportDeclaration(node) && node.moduleSpecifier && ts.isStringLiteral(node.moduleSpecifier)) {
      add(node.moduleSpecifier.text, node.isTypeOnly);
    } else if (ts.isCallExpression(node) && node.expression.kind === ts.SyntaxKind.ImportKeyword && node.arguments[0] && ts.isStringLiteral(node.arguments[0])) {
      add(node.arguments[0].text, false);
    }
    ts.forEachChild(node, visit);
  };
  visit(source);
  return found;
}

const FILES = sourceFiles();
const IMPORTS = FILES.flatMap(importsOf);

describe("layers", () => {
  it("reads the application's source", () => {
    // A guard against a path mistake that would make every rule pass vacuously.
    expect(FILES.length).toBeGreaterThan(100);
    expect(IMPORTS.some((imported) => imported.target === "lib/services/status.ts")).toBe(true);
  });

  for (const rule of RULES) {
    it(rule.name, () => {
      const violations = IMPORTS.filter((imported) => rule.from(imported.file) && rule.forbids(imported))
        .filter((imported) => !ALLOWED.some((allowed) => allowed.file === imported.file && (imported.target ?? imported.specifier).startsWith(allowed.targetsUnder)))
        .map((imported) => `${imported.file} → ${imported.specifier}`);
      expect(violations).toEqual([]);
    });
  }

  it("only lib/auth/permissions.ts and authorize.ts compare roles", () => {
    const deciders = new Set(["lib/auth/permissions.ts", "lib/auth/authorize.ts"]);
    const roleTest = /\brole\s*[!=]==?\s*["'`]|["'`]\s*[!=]==?\s*\w+\.role\b|\.role\s*,\s*\[\s*["']/;
    const violations = FILES.filter((file) => !deciders.has(file) && roleTest.test(fs.readFileSync(path.join(ROOT, file), "utf8")));
    expect(violations).toEqual([]);
  });

  it("finds a violation when there is one", () => {
    // The checker itself: a pure module taking a service would be reported.
    const planted: Import = { file: "lib/fatigue/x.ts", specifier: "@/lib/services/alerts", target: "lib/services/alerts.ts", typeOnly: false };
    expect(RULES[0]!.from(planted.file) && RULES[0]!.forbids(planted)).toBe(true);
    expect(typeVocabulary({ ...planted, target: "db/schema.ts", typeOnly: true })).toBe(true);
  });
});
