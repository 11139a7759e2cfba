import type { Transaction } from 'sequelize'
import { User } from '../models/index.ts'

/** E-mail addresses of the active users of an organisation with the given role. */
export async function organisationEmails(
  organisationId: number,
  role: User['role'],
  transaction?: Transaction,
): Promise<string[]> {
  const users = await User.findAll({
    where: { organisationId, role, active: true },
    attributes: ['email'],
    order: [['id', 'ASC']],
    transaction,
  })
  return users.map((u) => u.email)
}

/** The address of one user, when the user exists and is active. */
export async function userEmail(userId: number, transaction?: Transaction): Promise<string[]> {
  const u = await User.findByPk(userId, { attributes: ['email', 'active'], transaction })
  return u && u.active ? [u.email] : []
}

/** E-mail addresses of every active user with a role, whatever the organisation (the permit office). */
export async function roleEmails(role: User['role'], transaction?: Transaction): Promise<string[]> {
  const users = await User.findAll({
    where: { role, active: true },
    attributes: ['email'],
    order: [['id', 'ASC']],
    transaction,
  })
  return users.map((u) => u.email)
}
