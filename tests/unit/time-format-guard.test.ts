import fs from "node:fs";
import path from "node:path";
import ts from "typescript";
import { describe, expect, it } from "vitest";

/**
 * Time a person reads goes through lib/time-format.ts, the one module that knows the format and
 * names the zone. This reads the application's source and fails naming file:line for each date
 * formatter anywhere else: Intl.DateTimeFormat, Date's toLocaleDateString / toLocaleTimeString,
 * date-fns's `format`, and `toLocaleString` unless it formats a number (a locale and only number
 * options). The check reads the source, not the types: a Date given to toLocaleString with a
 * locale and no options would pass, which the rest of the code base has no reason to write.
 */

const ROOT = path.resolve(__dirname, "../..");
const FOLDERS = ["app", "components", "lib", "jobs"];
const THE_MODULE = "lib/time-format.ts";

/** Options of Intl.NumberFormat (ECMA-402) that the code base passes to Number#toLocaleString. */
const NUMBER_OPTIONS = new Set(["minimumFractionDigits", "maximumFractionDigits", "maximumSignificantDigits", "minimumSignificantDigits", "signDisplay", "useGrouping", "notation", "style", "unit"]);

function sourceFiles(folder: string): string[] {
  const found: string[] = [];
  for (const entry of fs.readdirSync(path.join(ROOT, folder), { withFileTypes: true })) {
    const relative = path.posix.join(folder, entry.name);
    if (entry.isDirectory()) found.push(...sourceFiles(relative));
    else if (/\.tsx?$/.test(entry.name) && !entry.name.endsWith(".d.ts")) found.push(relative);
  }
  return found;
}

/** A toLocaleString call that formats a number: a string locale, then nothing or an object of number options only. */
function formatsNumber(call: ts.CallExpression): boolean {
  const [locale, options, ...rest] = call.arguments;
  if (!locale || !ts.isStringLiteral(locale) || rest.length > 0) return false;
  if (!options) return true;
  return ts.isObjectLiteralExpression(options) && options.properties.every((property) => property.name !== undefined && ts.isIdentifier(property.name) && NUMBER_OPTIONS.has(property.name.text));
}

/** Every date formatter in a source text, as "file:line what". */
export function dateFormattersIn(file: string, text: string): string[] {
  const source = ts.createSourceFile(file, text, ts.ScriptTarget.Latest, true, file.endsWith(".tsx") ? ts.ScriptKind.TSX : ts.ScriptKind.TS);
  const dateFnsFormat = new Set<string>();
  for (const statement of source.statements) {
    if (!ts.isImportDeclaration(statement) || !ts.isStringLiteral(statement.moduleSpecifier)) continue;
    if (!/^(date-fns|@date-fns\/tz)(\/|$)/.test(statement.moduleSpecifier.text)) continue;
    const named = statement.importClause?.namedBindings;
    if (named && ts.isNamedImports(named)) {
      for (const element of named.elements) if ((element.propertyName ?? element.name).text === "format") dateFnsFormat.add(element.name.text);
    }
  }
  const found: string[] = [];
  const at = (node: ts.Node, what: string) => found.push(`${file}:${source.getLineAndCharacterOfPosition(node.getStart()).line + 1} ${what}`);
  const visit = (node: ts.Node) => {
    if (ts.isPropertyAccessExpression(node) && ts.isIdentifier(node.expression) && node.expression.text === "Intl" && node.name.text === "DateTimeFormat") at(node, "Intl.DateTimeFormat");
    if (ts.isCallExpression(node)) {
      const callee = node.expression;
      if (ts.isPropertyAccessExpression(callee)) {
        const name = callee.name.text;
        if (name === "toLocaleDateString" || name === "toLocaleTimeString") at(node, name);
        if (name === "toLocaleString" && !formatsNumber(node)) at(node, "toLocaleString of a date, or without a locale");
      }
      if (ts.isIdentifier(callee) && dateFnsFormat.has(callee.text)) at(node, "date-fns format()");
    }
    ts.forEachChild(node, visit);
  };
  visit(source);
  return found;
}

describe("one way to show time", () => {
  it("formats dates only in lib/time-format.ts", () => {
    const files = FOLDERS.flatMap(sourceFiles).filter((file) => file !== THE_MODULE);
    expect(files.length).toBeGreaterThan(100);
    const found = files.flatMap((file) => dateFormattersIn(file, fs.readFileSync(path.join(ROOT, file), "utf8")));
    expect(found, "format these through lib/time-format.ts").toEqual([]);
    // Parsing some 600 files takes seconds on a busy machine: a time limit, not a speed target.
  }, 30_000);

  it("catches each kind of date formatter, and lets number formatting through", () => {
    const text = [
      'import { format as fmt } from "date-fns";',
      'const a = new Intl.DateTimeFormat("en-GB").format(0);',
      "const b = new Date().toLocaleDateString();",
      'const c = new Date().toLocaleString("en-GB", { timeZone: "UTC" });',
      'const d = fmt(0, "yyyy");',
      'const e = (1234.5).toLocaleString("en-US", { maximumFractionDigits: 1 });',
      "const f = (12).toLocaleString();",
    ].join("\n");
    expect(dateFormattersIn("x.ts", text)).toEqual([
      "x.ts:2 Intl.DateTimeFormat",
      "x.ts:3 toLocaleDateString",
      "x.ts:4 toLocaleString of a date, or without a locale",
      "x.ts:5 date-fns format()",
      "x.ts:7 toLocaleString of a date, or without a locale",
    ]);
  });
});
