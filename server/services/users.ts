import bcrypt from 'bcrypt'
import { UniqueConstraintError } from 'sequelize'
import type {
  CreateOrganisationInput,
  CreateUserInput,
  UpdateUserInput,
} from '../../shared/schemas/auth.ts'
import type { OrganisationDto, UserDto } from '../../shared/types/user.ts'
import { passwordProblem } from '../../shared/schemas/password-rules.ts'
import { endSessionsOfUser } from '../auth/user-sessions.ts'
import { config } from '../config.ts'
import { conflict, notFound, validationFailed } from '../errors.ts'
import { Organisation, User } from '../models/index.ts'
import { recordAudit } from './audit.ts'

export function toOrganisationDto(o: Organisation): OrganisationDto {
  return {
    id: o.id,
    name: o.name,
    kind: o.kind,
    medium: o.medium,
    createdAt: o.createdAt.toISOString(),
  }
}

/** The API shape of a user; the user must be loaded with its organisation. */
export function toUserDto(u: User): UserDto {
  if (!u.organisation) throw new Error('toUserDto needs the organisation loaded')
  return {
    id: u.id,
    email: u.email,
    name: u.name,
    role: u.role,
    active: u.active,
    organisation: toOrganisationDto(u.organisation),
    lastSignInAt: u.lastSignInAt ? u.lastSignInAt.toISOString() : null,
    createdAt: u.createdAt.toISOString(),
  }
}

export const hashPassword = (password: string) => bcrypt.hash(password, config().BCRYPT_COST)

export async function findUserWithOrganisation(id: number): Promise<User | null> {
  return User.findByPk(id, { include: [{ model: Organisation, as: 'organisation' }] })
}

export async function listOrganisations(): Promise<OrganisationDto[]> {
  const rows = await Organisation.findAll({ order: [['name', 'ASC']] })
  return rows.map(toOrganisationDto)
}

export async function createOrganisation(
  input: CreateOrganisationInput,
  actorUserId: number,
): Promise<OrganisationDto> {
  try {
    const org = await Organisation.create({
      name: input.name,
      kind: input.kind,
      medium: input.kind === 'network_owner' ? (input.medium ?? null) : null,
    })
    await recordAudit({
      actorUserId,
      action: 'organisation-created',
      entityType: 'organisation',
      entityId: org.id,
      details: { name: org.name, kind: org.kind },
    })
    return toOrganisationDto(org)
  } catch (err) {
    if (err instanceof UniqueConstraintError) {
      throw conflict('An organisation with this name exists', [
        { field: 'name', message: 'Already taken' },
      ])
    }
    throw err
  }
}

export async function listUsers(): Promise<UserDto[]> {
  const rows = await User.findAll({
    include: [{ model: Organisation, as: 'organisation' }],
    order: [['name', 'ASC']],
  })
  return rows.map(toUserDto)
}

export async function createUser(
  input: CreateUserInput,
  actorUserId: number | null,
): Promise<UserDto> {
  const org = await Organisation.findByPk(input.organisationId)
  if (!org) throw validationFailed([{ field: 'organisationId', message: 'No such organisation' }])
  const passwordHash = await hashPassword(input.password)
  try {
    const user = await User.create({
      email: input.email,
      name: input.name,
      role: input.role,
      organisationId: org.id,
      passwordHash,
      lockedUntil: null,
      lastSignInAt: null,
    })
    await recordAudit({
      actorUserId,
      action: 'user-created',
      entityType: 'user',
      entityId: user.id,
      details: { email: user.email, role: user.role, organisationId: org.id },
    })
    user.organisation = org
    return toUserDto(user)
  } catch (err) {
    if (err instanceof UniqueConstraintError) {
      throw conflict('A user with this e-mail address exists', [
        { field: 'email', message: 'Already registered' },
      ])
    }
    throw err
  }
}

export async function updateUser(
  id: number,
  input: UpdateUserInput,
  actorUserId: number,
): Promise<UserDto> {
  const user = await findUserWithOrganisation(id)
  if (!user) throw notFound('user', id)
  if (input.name !== undefined) user.name = input.name
  if (input.role !== undefined) user.role = input.role
  if (input.active !== undefined) user.active = input.active
  if (input.password !== undefined) {
    const problem = passwordProblem(input.password, user.email)
    if (problem) throw validationFailed([{ field: 'password', message: problem }])
    user.passwordHash = await hashPassword(input.password)
    user.failedSignIns = 0
    user.lockedUntil = null
  }
  await user.save()
  // A password set by an administrator signs the account out everywhere (not the admin's own).
  if (input.password !== undefined && user.id !== actorUserId)
    await endSessionsOfUser(User.sequelize!, user.id)
  const changed = Object.keys(input).filter((k) => k !== 'password')
  await recordAudit({
    actorUserId,
    action: 'user-updated',
    entityType: 'user',
    entityId: user.id,
    details: { changed, passwordReset: input.password !== undefined },
  })
  return toUserDto(user)
}
