import type { Role } from "./schema";
import { createStructure, findStructureByCode } from "@/lib/services/structures";
import { addMember } from "@/lib/services/memberships";
import { createUser, findUserByEmail } from "@/lib/services/users";
import { isUniqueViolation } from "./client";
import { AppError } from "@/lib/errors";
import type { UserActor } from "@/lib/auth/actor";
import { createGauge, listGauges } from "@/lib/services/gauges";
import { createRosette } from "@/lib/services/rosettes";
import { listDrawings, placeGauge, uploadDrawing } from "@/lib/services/files";
import { DEMO_DRAWINGS } from "./demo-drawings";
import { DEMO_GAUGES, DEMO_ROSETTES, demoPeriod } from "./demo-gauges";

/**
 * The demo scenario, invented from end to end: the Brennock Valley Transport Trust owns a
 * steel truss footbridge and a post-tensioned concrete parking deck, watched by one
 * engineer and one technician.
 */
export const DEMO_USERS: { email: string; name: string; role: Role; password: string; structures: string[] }[] = [
  { email: "admin@hookeline.example", name: "Morgan Hale", role: "admin", password: "admin-demo", structures: [] },
  { email: "engineer@hookeline.example", name: "Priya Venn", role: "engineer", password: "engineer-demo", structures: ["MILL-FB", "ORCH-PD"] },
  { email: "technician@hookeline.example", name: "Tomas Reed", role: "technician", password: "technician-demo", structures: ["MILL-FB"] },
  { email: "owner@hookeline.example", name: "Iris Calder", role: "owner", password: "owner-demo", structures: ["MILL-FB", "ORCH-PD"] },
];

export const DEMO_STRUCTURES = [
  {
    code: "MILL-FB",
    name: "Millrace Footbridge",
    location: "Kestrel Lane, Brennock",
    timezone: "Europe/London",
    description:
      "Steel Warren-truss footbridge, 42 m span, over the Brennock millrace. Owner: Brennock Valley Transport Trust. " +
      "Monitored after a 2026 repair of the lower chord.",
  },
  {
    code: "ORCH-PD",
    name: "Orchard Street Parking Deck",
    location: "Orchard Street, Brennock",
    timezone: "Europe/London",
    description:
      "Four-level post-tensioned concrete parking deck. Owner: Brennock Valley Transport Trust. " +
      "Monitored while cracked level-2 slabs wait for strengthening.",
  },
];

async function ignoreExisting(work: Promise<unknown>) {
  try {
    await work;
  } catch (error) {
    if (error instanceof AppError && error.code === "conflict") return;
    if (isUniqueViolation(error)) return;
    throw error;
  }
}

async function actorFor(email: string): Promise<UserActor> {
  const user = await findUserByEmail(email);
  if (!user) throw new Error(`Demo user ${email} is missing`);
  return { kind: "user", id: user.id, email: user.email, name: user.name, role: user.role };
}

/** The technician registered the footbridge's gauges; the engineer those of the parking deck. */
async function seedGauges(now: number) {
  const installedAt = new Date(demoPeriod(now).start - 86_400_000).toISOString();
  const installers: Record<string, UserActor> = {
    "MILL-FB": await actorFor("technician@hookeline.example"),
    "ORCH-PD": await actorFor("engineer@hookeline.example"),
  };
  for (const { structure, input } of DEMO_GAUGES) {
    const installer = installers[structure]!;
    const existing = await listGauges(installer, structure);
    if (existing.some((gauge) => gauge.tag === input.tag)) continue;
    await createGauge(installer, structure, { ...input, zero: { ...input.zero, time: installedAt } });
  }
  for (const rosette of DEMO_ROSETTES) {
    const engineer = await actorFor("engineer@hookeline.example");
    await ignoreExisting(createRosette(engineer, rosette.structure, rosette));
  }
}

/** Each structure gets its drawing once, with the demo gauges placed where they are installed. */
async function seedDrawings() {
  const engineer = await actorFor("engineer@hookeline.example");
  for (const drawing of DEMO_DRAWINGS) {
    if ((await listDrawings(engineer, drawing.structure)).length > 0) continue;
    const uploaded = await uploadDrawing(engineer, drawing.structure, { bytes: drawing.png(), fields: { title: drawing.title } });
    for (const [tag, [x, y]] of Object.entries(drawing.placements)) {
      await placeGauge(engineer, drawing.structure, tag, { drawingId: uploaded.id, x, y });
    }
  }
}

/** Creates what is missing of the demo scenario; running it again changes nothing. */
export async function seedDemo(now = Date.now()): Promise<void> {
  for (const structure of DEMO_STRUCTURES) {
    if (!(await findStructureByCode(structure.code))) await createStructure(null, structure);
  }
  for (const user of DEMO_USERS) {
    if (!(await findUserByEmail(user.email))) {
      await createUser(null, { email: user.email, name: user.name, role: user.role, password: user.password });
    }
    for (const code of user.structures) await ignoreExisting(addMember(null, user.email, code));
  }
  await seedGauges(now);
  await seedDrawings();
}
