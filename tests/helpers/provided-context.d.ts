// What the server project's global setup hands to the tests through vitest's provide/inject.
declare module 'vitest' {
  export interface ProvidedContext {
    /** Environment of an app instance on the test database (see tests/helpers/local-env.ts). */
    testEnv: Record<string, string>
  }
}

export {}
