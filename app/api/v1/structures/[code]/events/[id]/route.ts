import { z } from "zod";
import { apiRoute, json, readJson } from "@/lib/api/http";
import { parseWith } from "@/lib/validation";
import { eventLabelInput } from "@/lib/api/burst-schemas";
import { getEvent, labelEvent } from "@/lib/services/dynamic-data";

type Params = { code: string; id: string };

const eventId = z.coerce.number({ error: "The event id is a number." }).int("The event id is a whole number.").positive("The event id is positive.");

export const GET = apiRoute<Params>(async ({ actor, params }) => json(await getEvent(actor, params.code, parseWith(eventId, params.id))));

/** Labels the event (engineers and admins); `label: null` clears it. */
export const PATCH = apiRoute<Params>(async ({ request, actor, params }) => {
  const id = parseWith(eventId, params.id);
  const { label } = await readJson(request, eventLabelInput);
  return json(await labelEvent(actor, params.code, id, label ?? null));
});

export * from "@/lib/api/method-not-allowed";
