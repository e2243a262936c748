/** Limits of one check, shared by the workers (which enforce them) and the web process (which waits). */

/** Step budget of a check (the core's default); CAIRN_VERIFY_STEP_LIMIT overrides it. */
export const STEP_LIMIT = Number(process.env.CAIRN_VERIFY_STEP_LIMIT) || 200_000_000;
/** Wall-clock limit of one check; past it the worker thread is stopped and the verdict is undecided. */
export const TIME_LIMIT_MS = Number(process.env.CAIRN_VERIFY_TIME_LIMIT_MS) || 120_000;
