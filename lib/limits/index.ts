/** Limit evaluation and sensor health for one gauge. Pure functions over plain JSON state, no I/O. */
export { LEVELS, QUANTITIES, levelRank, type Level, type Limit, type LimitInput, type Quantity } from "./limit";
export { validateLimits, type LimitField, type LimitProblem, type LimitProblemCode, type LimitSetValidation } from "./validate-limits";
export { clearBand, type ClearBand } from "./bounds";
