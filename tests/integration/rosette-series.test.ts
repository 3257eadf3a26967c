import { beforeAll, describe, expect, it } from "vitest";
import * as route from "@/app/api/v1/structures/[code]/rosettes/[tag]/series/route";
import { createGauge } from "@/lib/services/gauges";
import { ingestJson } from "@/lib/services/ingest";
import { createRosette } from "@/lib/services/rosettes";
import { microstrainGauge } from "../fixtures/gauges";
import { apiRequest, makeStructure, makeUser, params, userToken } from "./helpers";

let token: string;
const T0 = Date.UTC(2026, 9, 1);

beforeAll(async () => {
  const engineer = await makeUser("engineer");
  await makeStructure("GUSSET", [engineer]);
  for (const tag of ["a", "b", "c"]) await createGauge(engineer, "GUSSET", microstrainGauge(tag));
  await createRosette(engineer, "GUSSET", { tag: "R1", layout: "rectangular", gauges: ["a", "b", "c"] });
  const times = [0, 1, 2].map((i) => new Date(T0 + i * 600_000).toISOString());
  // The same strain state three times, plus a reading of gauge a alone that has no partners.
  await ingestJson(engineer, "GUSSET", [
    ...times.flatMap((time) => [
      { gauge: "a", time, value: 500 },
      { gauge: "b", time, value: 300 },
      { gauge: "c", time, value: -100 },
    ]),
    { gauge: "a", time: new Date(T0 + 3 * 600_000).toISOString(), value: 9000 },
  ]);
  token = await userToken(engineer.email);
});

const series = (quantity: string) =>
  route.GET(
    apiRequest(`/structures/GUSSET/rosettes/R1/series?quantity=${quantity}&from=${new Date(T0).toISOString()}&to=${new Date(T0 + 3_600_000).toISOString()}`, { token }),
    params({ code: "GUSSET", tag: "R1" }),
  );

describe("rosette series", () => {
  // Rectangular rosette εa = 500, εb = 300, εc = −100 µε on steel (E = 200 GPa, ν = 0.3), worked by hand
  // with the rectangular-rosette relations of Dally & Riley (rosette chapter) and plane-stress Hooke's law:
  // ε1,2 = 200 ± ½√(600² + 200²) = 516.23 / −116.23 µε; σ1 = E/(1−ν²)(ε1 + νε2) = 105.79 MPa,
  // σ2 = 8.49 MPa; σvm = √(σ1² − σ1σ2 + σ2²) = 101.81 MPa; τmax = (σ1 − σ2)/2 = 48.65 MPa.
  it.each([
    ["sigma1", 105.793],
    ["sigma2", 8.4924],
    ["vonMises", 101.813],
    ["tauMax", 48.650],
  ])("%s from readings of the three gauges at the same time", async (quantity, expected) => {
    const response = await series(quantity);
    expect(response.status).toBe(200);
    const body = await response.json();
    expect(body.unit).toBe("MPa");
    expect(body.count.reduce((a: number, b: number) => a + b, 0)).toBe(3);
    for (const value of [...body.min, ...body.max]) expect(value).toBeCloseTo(expected, 2);
  });

  it("answers 404 for an unknown rosette and 400 for an unknown quantity", async () => {
    const missing = await route.GET(apiRequest("/structures/GUSSET/rosettes/NOPE/series", { token }), params({ code: "GUSSET", tag: "NOPE" }));
    expect(missing.status).toBe(404);
    expect((await series("sigma3")).status).toBe(400);
  });
});
