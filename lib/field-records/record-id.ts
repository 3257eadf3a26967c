import { z } from "zod";

/** A certificate's or a visit's id from the URL: a positive whole number. */
export const recordId = (what: string) => {
  const rule = `A ${what} id is a positive whole number.`;
  return z.coerce.number({ error: rule }).int(rule).positive(rule).max(Number.MAX_SAFE_INTEGER, rule);
};
