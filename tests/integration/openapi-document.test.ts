import { execFile } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { promisify } from "node:util";
import { describe, expect, it } from "vitest";
import { GET as servedDocument } from "@/app/api/v1/openapi.json/route";

type Problem = { ruleId: string; severity: string; message: string; location: { pointer: string }[] };

/** Redocly CLI's `lint` (a widely used OpenAPI 3.1 validator) with the project's redocly.yaml. */
async function redoclyLint(document: unknown) {
  const folder = fs.mkdtempSync(path.join(os.tmpdir(), "hookeline-openapi-"));
  const file = path.join(folder, "openapi.json");
  fs.writeFileSync(file, JSON.stringify(document));
  try {
    const cli = path.resolve("node_modules/@redocly/cli/bin/cli.js");
    // lint exits non-zero when it finds errors; its JSON report is on stdout either way.
    const { stdout } = await promisify(execFile)(process.execPath, [cli, "lint", file, "--format=json", "--config=redocly.yaml"], {
      env: { ...process.env, REDOCLY_TELEMETRY: "off", REDOCLY_SUPPRESS_UPDATE_NOTICE: "true" },
      maxBuffer: 64 * 1024 * 1024,
    }).catch((error: { stdout?: string }) => ({ stdout: error.stdout ?? "" }));
    return JSON.parse(stdout) as { totals: { errors: number; warnings: number }; problems: Problem[] };
  } finally {
    fs.rmSync(folder, { recursive: true, force: true });
  }
}

describe("the served OpenAPI document", () => {
  it("passes Redocly's recommended rules with no error and no warning", async () => {
    const report = await redoclyLint(await servedDocument().json());
    const problems = report.problems.map((p) => `${p.severity} ${p.ruleId} at ${p.location[0]?.pointer}: ${p.message}`);
    expect(problems).toEqual([]);
    expect(report.totals).toMatchObject({ errors: 0, warnings: 0 });
  }, 60_000);

  it("names every schema once under components.schemas, the error body included, and refers to it there", async () => {
    const document = await servedDocument().json();
    const schemas = document.components.schemas;
    expect(schemas.Error.properties.error.required).toEqual(expect.arrayContaining(["code", "message"]));
    const refs = [...JSON.stringify(document).matchAll(/"\$ref":"([^"]+)"/g)].map((match) => match[1]!);
    expect(refs.filter((ref) => !ref.startsWith("#/components/schemas/"))).toEqual([]);
    expect(new Set(refs.map((ref) => ref.split("/").pop()))).toEqual(new Set(Object.keys(schemas)));
    const badRequest = document.paths["/structures"].post.responses["400"].content["application/json"].schema;
    expect(badRequest).toEqual({ $ref: "#/components/schemas/Error" });
  });
});
