/**
 * A limit alert that clears and opens again and again is one flapping episode, not many. Alarm
 * management practice (ISA-18.2 "chattering" alarms, from memory: three or more activations within
 * a minute) counts activations in a short window; readings here come minutes apart, so the window is
 * an hour, six readings at the usual ten-minute interval, and three openings within it make the
 * alert flapping. Its crossings are then told in one e-mail when it starts and one summary when it
 * has stayed clear for a whole window.
 */
export const FLAP_WINDOW_MS = 3_600_000;
export const FLAP_OPENINGS = 3;

export function isFlappingNow(openings: number): boolean {
  return openings >= FLAP_OPENINGS;
}

/** Whether `value` lies further beyond `bound` than `peak`, on the side `value` is. */
export function isFurther(value: number, peak: number, bound: number): boolean {
  return value >= bound ? value > peak : value < peak;
}

/** Readings this much older than their arrival are history: their alert events go to the next digest, not an immediate e-mail. */
export const IMMEDIATE_MAIL_MAX_AGE_MS = 86_400_000;
