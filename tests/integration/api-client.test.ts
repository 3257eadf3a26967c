import createClient from "openapi-fetch";
import openapiTS, { astToString } from "openapi-typescript";
import { beforeAll, describe, expect, it } from "vitest";
import { GET as servedDocument } from "@/app/api/v1/openapi.json/route";
import type { paths } from "./generated/api-v1";
import { makeUser, userToken } from "./helpers";
import { STRAIN_GAUGE } from "./readings-fixtures";
import { routeFetch } from "./route-fetch";

let token: string;

beforeAll(async () => {
  const admin = await makeUser("admin");
  token = await userToken(admin.email);
});

describe("a client generated from the served document", () => {
  // openapi-typescript's output is checked in so that `tsc` checks the calls below against it;
  // after changing the API, refresh it with `npx vitest run tests/integration/api-client.test.ts -u`.
  // A field with a default may be left out of a request, so a default does not make it required.
  it("is the checked-in one", async () => {
    const types = astToString(await openapiTS(await servedDocument().json(), { defaultNonNullable: false }));
    await expect(types).toMatchFileSnapshot("./generated/api-v1.ts");
  });

  it("creates a structure and a gauge, sends readings and reads the stress series back (openapi-fetch)", async () => {
    const api = createClient<paths>({ baseUrl: "http://localhost/api/v1", fetch: routeFetch, headers: { authorization: `Bearer ${token}` } });

    const structure = await api.POST("/structures", { body: { code: "CLIENT-1", name: "Client test footbridge", timezone: "UTC" } });
    expect(structure.response.status).toBe(201);
    expect(structure.data?.code).toBe("CLIENT-1");
    const code = structure.data!.code;

    const gauge = await api.POST("/structures/{code}/gauges", { params: { path: { code } }, body: STRAIN_GAUGE });
    expect(gauge.response.status).toBe(201);
    expect(gauge.data?.tag).toBe("S1");

    const times = ["2026-04-01T10:00:00Z", "2026-04-01T10:10:00Z", "2026-04-01T10:20:00Z"];
    const values = [100, 250, -40];
    const sent = await api.POST("/structures/{code}/readings", {
      params: { path: { code } },
      body: { readings: times.map((time, i) => ({ gauge: "S1", time, value: values[i], temperature: 20 })) },
    });
    expect(sent.data).toMatchObject({ accepted: 3, duplicates: 0, rejected: [] });

    const refused = await api.POST("/structures/{code}/readings", { params: { path: { code } }, body: { readings: "none" as never } });
    expect(refused.response.status).toBe(400);
    expect(refused.error?.error.code).toBeTypeOf("string");

    const series = await api.GET("/structures/{code}/gauges/{tag}/series", {
      params: { path: { code, tag: "S1" }, query: { quantity: "stress", from: "2026-04-01T00:00:00Z", to: "2026-04-02T00:00:00Z", points: "1" } },
    });
    expect(series.response.status).toBe(200);
    expect(series.data?.unit).toBe("MPa");
    // S1 reads microstrain with zero 0 and no compensation, so strain = value; Hooke's law σ = E·ε
    // (any mechanics-of-materials textbook) with E = 200 000 MPa gives 0.2 MPa per µε.
    expect(series.data?.count).toEqual([3]);
    expect(series.data?.max[0]).toBeCloseTo(250 * 0.2, 9);
    expect(series.data?.min[0]).toBeCloseTo(-40 * 0.2, 9);
    expect(series.data?.mean[0]).toBeCloseTo(((100 + 250 - 40) / 3) * 0.2, 9);

    // A gauge's bursts are sent and read back here too once the API has them.
  });
});
