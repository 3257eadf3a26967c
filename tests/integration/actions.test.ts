import { beforeAll, describe, expect, it, vi } from "vitest";
import type { UserActor } from "@/lib/auth/actor";
import { getLimits } from "@/lib/services/limits";
import { getGauge } from "@/lib/services/gauges";
import { makeStructure, makeUser } from "./helpers";

// Server actions run as the signed-in user: the session is the one thing replaced here; the
// actions, services, authorization and database are the real ones.
const session = vi.hoisted(() => ({ user: null as UserActor | null }));
vi.mock("@/lib/auth/session", () => ({ currentUser: async () => session.user }));
vi.mock("next/cache", () => ({ revalidatePath: () => undefined }));

const { registerGaugeAction, saveLimitsAction, recordZeroAction } = await import("@/app/(app)/structures/[code]/gauges/actions");

const users: Record<string, UserActor> = {};
const gauge = (tag: string) => ({
  tag,
  kind: "foil",
  input: "microstrain",
  gaugeFactor: 2.05,
  polarity: 1,
  thermal: { method: "none" },
  material: { E: 210000, nu: 0.3, alpha: 12, yield: 355 },
  initialStress: 0,
  zero: { value: 3, temperature: 11 },
});

beforeAll(async () => {
  for (const role of ["engineer", "technician", "owner"] as const) users[role] = await makeUser(role);
  await makeStructure("ACT", Object.values(users));
});

const as = (role: string) => (session.user = users[role]!);
const zeroForm = (fields: Record<string, string>) => {
  const form = new FormData();
  for (const [name, value] of Object.entries(fields)) form.set(name, value);
  return form;
};

describe("gauge actions, role by role", () => {
  it("lets a technician register a gauge and refuses an owner", async () => {
    as("technician");
    expect(await registerGaugeAction("ACT", gauge("T-1"))).toMatchObject({ status: "ok" });
    as("owner");
    const refused = await registerGaugeAction("ACT", gauge("O-1"));
    expect(refused).toMatchObject({ status: "error", message: "The owner role may not do this." });
  });

  it("answers a duplicate tag on its field, and nothing is half-saved", async () => {
    as("engineer");
    const duplicate = await registerGaugeAction("ACT", { ...gauge("T-1"), gaugeFactor: 2.2 });
    expect(duplicate.fieldErrors?.tag?.[0]).toContain('"T-1"');
    expect((await getGauge(users.engineer!, "ACT", "T-1")).gaugeFactor).toBe(2.05);
  });

  it("refuses limits from a technician and saves them for an engineer", async () => {
    const limits = { limits: [{ quantity: "stress", level: "watch", upper: 120 }] };
    as("technician");
    expect(await saveLimitsAction("ACT", "T-1", limits)).toMatchObject({ status: "error", message: "The technician role may not do this." });
    as("engineer");
    expect(await saveLimitsAction("ACT", "T-1", limits)).toMatchObject({ status: "ok" });
    expect(await getLimits(users.owner!, "ACT", "T-1")).toEqual([{ quantity: "stress", level: "watch", upper: 120, hysteresis: 0, persistence: 1 }]);
  });

  it("records a zero for a technician; a blank value is an error, not a zero", async () => {
    as("technician");
    const blank = await recordZeroAction({ status: "idle" }, zeroForm({ code: "ACT", tag: "T-1", source: "typed", value: "", temperature: "9" }));
    expect(blank.status).toBe("error");
    const typed = await recordZeroAction({ status: "idle" }, zeroForm({ code: "ACT", tag: "T-1", source: "typed", value: "4.5", temperature: "9", reason: "after painting" }));
    expect(typed.status).toBe("ok");
    expect((await getGauge(users.owner!, "ACT", "T-1")).zero).toMatchObject({ value: 4.5, temperature: 9 });
  });

  it("tells a signed-out caller to sign in again", async () => {
    session.user = null;
    expect(await registerGaugeAction("ACT", gauge("X-1"))).toMatchObject({ status: "error", message: "Your session has ended. Sign in again." });
  });
});
