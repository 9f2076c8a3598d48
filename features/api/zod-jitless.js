// Imported first by the web entry (index.js at the project root), before any module that loads zod.
//
// zod compiles fast object parsers with `new Function` and probes for that ability with a caught
// `new Function("")`. Under our Content-Security-Policy (no 'unsafe-eval') the probe is refused,
// and the browser reports a CSP violation on every page even though zod falls back quietly. zod
// reads `jitless` from this global when it builds its first schema, so it has to be set before
// any schema module runs. The server keeps the compiled parsers.
globalThis.__zod_globalConfig = Object.assign(globalThis.__zod_globalConfig || {}, { jitless: true });
