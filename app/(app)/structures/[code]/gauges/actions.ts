"use server";

import { z } from "zod";
import { formAction, objectAction } from "@/lib/actions/form-action";
import type { ActionState } from "@/lib/actions/action-state";
import { formatDifference, formatShuntOutput } from "@/lib/gauges/shunt-display";
import { inputUnit } from "@/lib/gauges/labels";
import { gaugeInput, gaugePatch, rosetteInput, shuntCheckInput, zeroInput } from "@/lib/gauges/schema";
import { recordShuntCheck } from "@/lib/services/shunt-checks";
import { createRosette } from "@/lib/services/rosettes";
import { limitsBody, rosetteLimitsBody } from "@/lib/alerting/schema";
import { replaceLimits } from "@/lib/services/limits";
import { replaceRosetteLimits } from "@/lib/services/rosette-limits";
import { setAlertMailMode } from "@/lib/services/memberships";
import { createGauge, recordZero, replaceGauge, retireGauge, updateGauge } from "@/lib/services/gauges";
import { optionalText, plainText, parseWith } from "@/lib/validation";

const structurePath = (code: string) => `/structures/${code}`;

export async function registerGaugeAction(code: string, payload: unknown): Promise<ActionState> {
  return objectAction(
    gaugeInput,
    payload,
    async (input, user) => {
      await createGauge(user, code, input);
      return { message: `Gauge ${input.tag} registered.` };
    },
    structurePath(code),
  );
}

export async function editGaugeAction(code: string, tag: string, payload: unknown): Promise<ActionState> {
  return objectAction(
    gaugePatch,
    payload,
    async (patch, user) => {
      await updateGauge(user, code, tag, patch);
      return { message: `Gauge ${tag} saved.` };
    },
    structurePath(code),
  );
}

export async function replaceGaugeAction(code: string, oldTag: string, payload: unknown): Promise<ActionState> {
  return objectAction(
    gaugeInput.and(z.object({ reason: plainText().trim().min(1, "Say why the gauge is replaced.").max(500) })),
    payload,
    async (input, user) => {
      await replaceGauge(user, code, oldTag, input, input.reason);
      return { message: `Gauge ${oldTag} replaced by ${input.tag}.` };
    },
    structurePath(code),
  );
}

const zeroForm = z.object({
  code: z.string(),
  tag: z.string(),
  source: z.enum(["typed", "readings"]),
  value: z.string().optional(),
  temperature: z.string().optional(),
  time: z.string().optional(),
  fromReadings: z.string().optional(),
  reason: optionalText(500),
});

/** A blank form field is "not given", not zero. */
const numberOrBlank = (text: string | undefined) => (text?.trim() ? Number(text.replace(",", ".")) : undefined);

const readingCount = z.number({ error: "Give how many readings to average." }).int("A whole number of readings.").min(1);

/** The zero form offers a typed value or the average of the last readings. */
export const recordZeroAction = formAction(
  zeroForm,
  async ({ code, tag, source, fromReadings, value, temperature, time, reason }, user) => {
    const request =
      source === "readings"
        ? { fromReadings: parseWith(readingCount, numberOrBlank(fromReadings)), reason }
        : { ...parseWith(zeroInput, { value: numberOrBlank(value), temperature: numberOrBlank(temperature) ?? null, time: time || undefined }), reason };
    await recordZero(user, code, tag, request);
    return { message: "New zero recorded; earlier results keep the zero they were computed with." };
  },
  "/structures",
);

/** The form's text fields as the shared schema reads them: numbers, and blanks as not given. */
const shuntCheckForm = z.preprocess(
  (raw) => {
    const fields = raw as Record<string, string | undefined>;
    return {
      ...fields,
      shuntResistance: numberOrBlank(fields.shuntResistance),
      measuredOutput: numberOrBlank(fields.measuredOutput),
      tolerancePercent: numberOrBlank(fields.tolerancePercent),
      time: fields.time || undefined,
    };
  },
  shuntCheckInput.extend({ code: z.string(), tag: z.string() }),
);

export const recordShuntCheckAction = formAction(
  shuntCheckForm,
  async ({ code, tag, ...input }, user) => {
    const check = await recordShuntCheck(user, code, tag, input);
    const figures = `measured ${formatShuntOutput(check.measuredOutput, inputUnit(check.unit))}, expected ${formatShuntOutput(check.expectedOutput, inputUnit(check.unit))}, difference ${formatDifference(check.differencePercent)} (tolerance ±${check.tolerancePercent} %)`;
    return {
      message: check.passed
        ? `Shunt check recorded: passed, ${figures}.`
        : `Shunt check recorded: FAILED, ${figures}. Check the bridge completion, the leads and the gauge's bond before trusting its readings.`,
    };
  },
  "/structures",
);

export const retireGaugeAction = formAction(
  z.object({ code: z.string(), tag: z.string(), reason: plainText().trim().min(1, "Say why the gauge is retired.").max(500) }),
  async ({ code, tag, reason }, user) => {
    await retireGauge(user, code, tag, reason);
    return { message: `Gauge ${tag} retired; it accepts no more readings.` };
  },
  "/structures",
);

export const createRosetteAction = formAction(
  z.object({ code: z.string(), tag: z.string(), layout: z.string(), a: z.string(), b: z.string(), c: z.string() }),
  async ({ code, tag, layout, a, b, c }, user) => {
    const input = parseWith(rosetteInput, { tag, layout, gauges: [a, b, c] });
    await createRosette(user, code, input);
    return { message: `Rosette ${tag} grouped.` };
  },
  "/structures",
);

export async function saveLimitsAction(code: string, tag: string, payload: unknown): Promise<ActionState> {
  return objectAction(
    limitsBody,
    payload,
    async ({ limits }, user) => {
      await replaceLimits(user, code, tag, limits);
      return { message: limits.length ? `${limits.length} limits saved for ${tag}.` : `All limits of ${tag} removed.` };
    },
    structurePath(code),
  );
}

export async function saveRosetteLimitsAction(code: string, tag: string, payload: unknown): Promise<ActionState> {
  return objectAction(
    rosetteLimitsBody,
    payload,
    async ({ limits }, user) => {
      await replaceRosetteLimits(user, code, tag, limits);
      return { message: limits.length ? `${limits.length} limits saved for rosette ${tag}.` : `All limits of rosette ${tag} removed.` };
    },
    `${structurePath(code)}/rosettes/${encodeURIComponent(tag)}`,
  );
}

export const alertMailAction = formAction(
  z.object({ code: z.string(), mode: z.enum(["immediate", "digest"]), sensorMode: z.enum(["immediate", "digest"]) }),
  async ({ code, mode, sensorMode }, user) => {
    await setAlertMailMode(user, code, mode);
    await setAlertMailMode(user, code, sensorMode, "sensor");
    if (mode === "digest") return { message: "You will get one digest a day." };
    return { message: `You will get each alert e-mail as it happens, and sensor faults ${sensorMode === "immediate" ? "as they happen too" : "in a daily digest"}.` };
  },
  "/structures",
);
