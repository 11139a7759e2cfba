import type { User as AppUser } from '../models/user.ts'

declare global {
  namespace Express {
    // passport attaches the signed-in user as req.user
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends AppUser {}
  }
}

export {}
