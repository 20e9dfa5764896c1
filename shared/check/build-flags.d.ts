/**
 * Defined as true by the studio's client build (vite.config.ts `define`) and
 * nowhere else. The browser's compile worker uses the plain compiler, never
 * the incremental one, so where the checker tests it (`TRACED` in context.ts)
 * the minifier drops the code that records and resumes traces. The server,
 * the command line and the tests have it undefined, so tracing works there.
 */
declare const __LW_NO_TRACE__: boolean | undefined;
