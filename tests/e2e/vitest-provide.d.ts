import 'vitest'

/** What tests/e2e/global-setup.ts provides to the browser tests. */
declare module 'vitest' {
  export interface ProvidedContext {
    /** Where the built app and API are served, e.g. http://127.0.0.1:41234 (no trailing slash). */
    baseUrl: string
    /** One signed-up user per role, created for the test run. */
    e2eUsers: {
      email: string
      password: string
      role: 'applicant' | 'asset_engineer' | 'permit_officer' | 'admin'
      name: string
    }[]
  }
}
