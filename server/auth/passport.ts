import passport from 'passport'
import { Strategy as LocalStrategy } from 'passport-local'
import { findUserWithOrganisation } from '../services/users.ts'
import { verifyCredentials } from '../services/auth.ts'

/**
 * passport-local over our credential check. The session keeps only the user id; each request
 * reloads the user, so a deactivated user or a changed role takes effect at once.
 */
export function configurePassport(): passport.PassportStatic {
  passport.use(
    new LocalStrategy(
      { usernameField: 'email', passwordField: 'password', passReqToCallback: true, session: true },
      (req, email, password, done) => {
        verifyCredentials(email, password, req.ip ?? null).then(
          (user) => done(null, user),
          (err: unknown) => done(err),
        )
      },
    ),
  )
  passport.serializeUser((user, done) => done(null, user.id))
  passport.deserializeUser((id: number, done) => {
    findUserWithOrganisation(id).then(
      (user) => done(null, user && user.active ? user : false),
      (err: unknown) => done(err),
    )
  })
  return passport
}
