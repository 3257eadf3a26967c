import { z } from "zod";
import { initialEpisodeState, initialSensorHealthState, LEVELS, type EpisodeState, type Quantity, type SensorHealthState } from "@/lib/limits";

/**
 * The stored shape of an evaluation state, checked when read back: a state written by an older
 * build (or damaged) is rebuilt by replaying stored readings, never trusted by a cast. Raise the
 * version whenever the shape or its meaning changes.
 */
export const EVALUATION_STATE_VERSION = 3;

/** An unresolved jump: readings after `since` are quarantined until an engineer resolves it. */
export type FaultHold = { since: number };

export type GaugeEvaluationState = {
  version: typeof EVALUATION_STATE_VERSION;
  episodes: Partial<Record<Quantity, EpisodeState>>;
  health: SensorHealthState;
  hold: FaultHold | null;
};

export function initialGaugeEvaluationState(): GaugeEvaluationState {
  return { version: EVALUATION_STATE_VERSION, episodes: {}, health: initialSensorHealthState(), hold: null };
}

const time = z.number().finite();
const count = z.number().int().nonnegative();

export const episodeStateSchema = z.object({
  lastTime: time.nullable(),
  beyondRuns: z.object({ watch: count, warning: count, critical: count }),
  insideRun: count,
  peak: z.number().nullable(),
  peakAt: time.nullable(),
  episode: z.object({ level: z.enum(LEVELS), openedAt: time, bound: z.number() }).nullable(),
});

const conditionSchema = z.object({ active: z.boolean() });

const healthSchema = z.object({
  lastTime: time.nullable(),
  flatLine: conditionSchema.extend({ recent: z.array(z.number()) }),
  jump: z.object({ previous: z.number().nullable(), suspect: z.object({ time, change: z.number() }).nullable() }),
  range: conditionSchema,
});

const gaugeStateSchema = z.object({
  version: z.literal(EVALUATION_STATE_VERSION),
  episodes: z.object({ stress: episodeStateSchema.optional(), strain: episodeStateSchema.optional(), utilisation: episodeStateSchema.optional(), residual: episodeStateSchema.optional() }),
  health: healthSchema,
  hold: z.object({ since: time }).nullable(),
});

/** The state if it is one this build wrote, else null: the caller rebuilds it. */
export function parseGaugeEvaluationState(stored: unknown): GaugeEvaluationState | null {
  const parsed = gaugeStateSchema.safeParse(stored);
  return parsed.success ? (parsed.data as GaugeEvaluationState) : null;
}

/**
 * The machine of `quantity` starts again from nothing, keeping only which readings it has seen: after
 * a hand clear, or when what it compares (limits, yield, zero) changed under it.
 */
export function restartEpisode(state: EpisodeState | undefined): EpisodeState {
  return { ...initialEpisodeState(), lastTime: state?.lastTime ?? null };
}

export function restartQuantities(state: GaugeEvaluationState, quantities: readonly Quantity[]): GaugeEvaluationState {
  const episodes = { ...state.episodes };
  for (const quantity of quantities) if (episodes[quantity]) episodes[quantity] = restartEpisode(episodes[quantity]);
  return { ...state, episodes };
}

/**
 * After a new zero the converted values move by the change of reference, so the jump detector
 * starts again (a re-zero is no jump) and a held jump is settled by that zero.
 */
export function restartAtNewZero(state: GaugeEvaluationState, quantities: readonly Quantity[]): GaugeEvaluationState {
  const restarted = restartQuantities(state, quantities);
  return { ...restarted, health: { ...restarted.health, jump: { previous: null, suspect: null } }, hold: null };
}

const rosetteStateSchema = z.object({
  version: z.literal(EVALUATION_STATE_VERSION),
  lastTime: time.nullable(),
  episodes: z.object({ sigma1: episodeStateSchema.optional(), sigma2: episodeStateSchema.optional(), vonMises: episodeStateSchema.optional() }),
  lastCheckpointAt: time.nullable().optional(),
});

/** A rosette's stored state (with its checkpoint time) if this build wrote it, else null: the caller replays. */
export function parseRosetteEvaluationState(stored: unknown): z.output<typeof rosetteStateSchema> | null {
  const parsed = rosetteStateSchema.safeParse(stored);
  return parsed.success ? parsed.data : null;
}
