/**
 * Outcome of a computation that can be refused. Failures carry a stable machine code (for the API's
 * `rejected[].code`) and a sentence telling the person what to fix.
 */
export interface Failure<Code extends string = string> {
  readonly ok: false;
  readonly code: Code;
  readonly message: string;
}

export type Result<Value extends object, Code extends string = string> =
  | ({ readonly ok: true } & Value)
  | Failure<Code>;

/** Frozen so the per-reading path can hand out the same failure object without allocating. */
export function failure<Code extends string>(code: Code, message: string): Failure<Code> {
  return Object.freeze({ ok: false, code, message });
}
