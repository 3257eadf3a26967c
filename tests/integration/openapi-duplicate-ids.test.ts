import { expect, it } from "vitest";
import { z } from "zod";
import { openApiDocument } from "@/lib/api/openapi";

/**
 * zod keeps its registry of named schemas on globalThis, so a server that has loaded the schema
 * modules in more than one bundle (pages, route handlers, server actions) holds a second, different
 * schema object under each id. The document must still be built from its own copy, unchanged.
 */
it("builds the same document when another copy of a named schema is registered under its id", () => {
  const before = openApiDocument();
  const schemas = before.components.schemas as Record<string, unknown>;
  expect(Object.keys(schemas)).toContain("Error");
  z.object({ somethingElse: z.number() }).meta({ id: "Error" });
  z.object({ another: z.string() }).meta({ id: Object.keys(schemas).find((id) => id !== "Error")! });
  expect(openApiDocument()).toEqual(before);
});
