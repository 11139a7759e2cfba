// Runs before the app's modules. zod builds its fast object parsers with `new Function` and
// probes for it when a schema is made; our Content-Security-Policy forbids eval, and the
// browser reports even the caught probe as a violation. jitless skips both (same results).
globalThis.__zod_globalConfig = Object.assign(globalThis.__zod_globalConfig || {}, {
  jitless: true,
})
