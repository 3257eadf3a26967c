import { beforeAll, describe, expect, it } from "vitest";
import * as list from "@/app/api/v1/structures/route";
import * as detail from "@/app/api/v1/structures/[code]/route";
import * as unknown from "@/app/api/v1/[...unknown]/route";
import { GET as openapi } from "@/app/api/v1/openapi.json/route";
import { revokeToken } from "@/lib/services/tokens";
import { updateUser } from "@/lib/services/users";
import type { UserActor } from "@/lib/auth/actor";
import { apiRequest, loggerToken, makeStructure, makeUser, noParams, params, userToken } from "./helpers";

let admin: UserActor;
const tokens: Record<string, string> = {};

beforeAll(async () => {
  admin = await makeUser("admin");
  const engineer = await makeUser("engineer");
  const technician = await makeUser("technician");
  const owner = await makeUser("owner");
  await makeStructure("BRIDGE-A", [engineer, technician, owner]);
  await makeStructure("DECK-B", [engineer]);
  for (const user of [admin, engineer, technician, owner]) tokens[user.role] = await userToken(user.email);
  tokens.logger = await loggerToken("BRIDGE-A");
});

async function codes(token: string) {
  const response = await list.GET(apiRequest("/structures", { token }), noParams);
  expect(response.status).toBe(200);
  const body = (await response.json()) as { structures: { code: string }[] };
  return body.structures.map((s) => s.code).sort();
}

async function expectError(response: Response, status: number, code: string) {
  expect(response.status).toBe(status);
  const body = (await response.json()) as { error: { code: string; message: string } };
  expect(body.error.code).toBe(code);
  expect(body.error.message.length).toBeGreaterThan(10);
  expect(JSON.stringify(body)).not.toMatch(/at \w+ \(|node_modules/);
  return body;
}

describe("GET /structures", () => {
  it("shows admins everything and others only their memberships", async () => {
    expect(await codes(tokens.admin!)).toEqual(["BRIDGE-A", "DECK-B"]);
    expect(await codes(tokens.engineer!)).toEqual(["BRIDGE-A", "DECK-B"]);
    expect(await codes(tokens.technician!)).toEqual(["BRIDGE-A"]);
    expect(await codes(tokens.owner!)).toEqual(["BRIDGE-A"]);
  });

  it("refuses a logger token: it may only send readings, not read its structure's name and place", async () => {
    const response = await list.GET(apiRequest("/structures", { token: tokens.logger! }), noParams);
    await expectError(response, 403, "forbidden");
  });

  it("answers 401 without a token, with a malformed header and with an unknown token", async () => {
    await expectError(await list.GET(apiRequest("/structures"), noParams), 401, "unauthorized");
    await expectError(
      await list.GET(apiRequest("/structures", { headers: { authorization: "Token abc" } }), noParams),
      401,
      "unauthorized",
    );
    await expectError(await list.GET(apiRequest("/structures", { token: "hkl_not-a-real-token" }), noParams), 401, "unauthorized");
  });
});

describe("GET /structures/{code}", () => {
  it("returns the structure with its gauges and open alerts", async () => {
    const response = await detail.GET(apiRequest("/structures/BRIDGE-A", { token: tokens.owner }), params({ code: "BRIDGE-A" }));
    expect(response.status).toBe(200);
    const body = await response.json();
    expect(body).toMatchObject({ code: "BRIDGE-A", timezone: "UTC", gauges: [], openAlerts: 0 });
    expect(body.createdAt).toMatch(/^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d\.\d{3}Z$/);
  });

  it("answers 404, not 403, for a structure the caller may not see", async () => {
    const hidden = await detail.GET(apiRequest("/structures/DECK-B", { token: tokens.technician }), params({ code: "DECK-B" }));
    const missing = await detail.GET(apiRequest("/structures/NOPE", { token: tokens.technician }), params({ code: "NOPE" }));
    await expectError(hidden, 404, "not_found");
    await expectError(missing, 404, "not_found");
  });
});

describe("POST /structures", () => {
  const post = (token: string | undefined, body: unknown, headers?: Record<string, string>) =>
    list.POST(apiRequest("/structures", { token, body, headers }), noParams);

  it("lets engineers create a structure, who then see it", async () => {
    const response = await post(tokens.engineer, { code: "TANK_3", name: "Water tank 3", timezone: "Europe/Oslo" });
    expect(response.status).toBe(201);
    expect(await response.json()).toMatchObject({ code: "TANK_3", name: "Water tank 3", timezone: "Europe/Oslo", location: null });
    expect(await codes(tokens.engineer!)).toContain("TANK_3");
  });

  it("defaults the time zone to UTC", async () => {
    const response = await post(tokens.admin, { code: "MAST-4", name: "Radio mast" });
    expect((await response.json()).timezone).toBe("UTC");
  });

  it("refuses technicians, owners and logger tokens with 403", async () => {
    for (const role of ["technician", "owner", "logger"]) {
      await expectError(await post(tokens[role], { code: `X-${role}`, name: "x" }), 403, "forbidden");
    }
  });

  it("answers 409 naming the duplicate code", async () => {
    const body = await expectError(await post(tokens.admin, { code: "BRIDGE-A", name: "Again" }), 409, "conflict");
    expect(body.error.message).toContain("BRIDGE-A");
  });

  it("explains each invalid field", async () => {
    const body = (await expectError(await post(tokens.admin, { code: "a b", timezone: "Mars/Olympus" }), 400, "validation_failed")) as unknown as {
      error: { details: { issues: { path: string; message: string }[] } };
    };
    const paths = body.error.details.issues.map((issue) => issue.path).sort();
    expect(paths).toEqual(["code", "name", "timezone"]);
  });

  it("answers 400 for malformed JSON and for a body that is not an object", async () => {
    await expectError(await post(tokens.admin, "{not json"), 400, "invalid_json");
    await expectError(await post(tokens.admin, "[1,2]"), 400, "bad_request");
    await expectError(await post(tokens.admin, "null"), 400, "bad_request");
  });

  it("answers 415 for a body that is not JSON", async () => {
    await expectError(await post(tokens.admin, "code=X", { "content-type": "application/x-www-form-urlencoded" }), 415, "unsupported_media_type");
  });

  it("answers 413 for a body over the limit", async () => {
    const huge = JSON.stringify({ code: "BIG", name: "x".repeat(1_100_000) });
    await expectError(await post(tokens.admin, huge), 413, "payload_too_large");
  });
});

describe("token life cycle", () => {
  it("stops a revoked token and the tokens of a deactivated user", async () => {
    const spare = await makeUser("engineer", "spare@test.example");
    const token = await userToken(spare.email);
    expect((await list.GET(apiRequest("/structures", { token }), noParams)).status).toBe(200);
    await updateUser(admin, spare.id, { active: false });
    await expectError(await list.GET(apiRequest("/structures", { token }), noParams), 401, "unauthorized");
    await updateUser(admin, spare.id, { active: true });
    expect((await list.GET(apiRequest("/structures", { token }), noParams)).status).toBe(200);
  });

  it("refuses a revoked logger token", async () => {
    const token = await loggerToken("DECK-B");
    const { listLoggerTokens } = await import("@/lib/services/tokens");
    const [issued] = await listLoggerTokens(admin, "DECK-B");
    await revokeToken(admin, issued!.id);
    await expectError(await list.GET(apiRequest("/structures", { token }), noParams), 401, "unauthorized");
  });
});

describe("the rest of /api/v1", () => {
  it("answers unknown paths with the contract's 404", async () => {
    await expectError(await unknown.GET(apiRequest("/gadgets")), 404, "not_found");
  });

  it("serves an OpenAPI 3.1 document whose request schema comes from the validator", async () => {
    const doc = await openapi().json();
    expect(doc.openapi).toBe("3.1.0");
    const post = doc.paths["/structures"].post;
    const { $ref } = post.requestBody.content["application/json"].schema;
    const schema = doc.components.schemas[$ref.replace("#/components/schemas/", "")];
    expect(schema.required).toEqual(expect.arrayContaining(["code", "name"]));
    expect(schema.properties.code.pattern).toBe("^[A-Za-z0-9_-]{2,32}$");
    expect(Object.keys(post.responses)).toEqual(expect.arrayContaining(["201", "400", "401", "403", "409"]));
  });
});
