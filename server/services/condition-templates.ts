import { UniqueConstraintError } from 'sequelize'
import type { Transaction } from 'sequelize'
import type {
  ConditionTemplateInput,
  ConditionTemplateUpdate,
} from '../../shared/schemas/condition-templates.ts'
import type { DecidedConditionInput } from '../../shared/schemas/reviews.ts'
import type { FieldIssue } from '../../shared/errors.ts'
import type { ConditionTemplateDto } from '../../shared/types/condition-templates.ts'
import type { DecidedCondition } from '../../shared/types/reviews.ts'
import { conflict, forbidden, notFound, validationFailed } from '../errors.ts'
import { ConditionTemplate } from '../models/index.ts'
import type { User } from '../models/user.ts'
import { recordAudit } from './audit.ts'

function parseJson<T>(v: unknown): T {
  return (typeof v === 'string' ? JSON.parse(v) : v) as T
}

/** A library condition as the API returns it. */
export function toConditionTemplateDto(t: ConditionTemplate): ConditionTemplateDto {
  return {
    id: t.id,
    code: t.code,
    title: t.title,
    text: t.text,
    parameters: parseJson(t.parameters),
    active: Boolean(t.active),
    attendanceNotice_h: t.attendanceNotice_h ?? null,
    photoKinds: parseJson<ConditionTemplateDto['photoKinds'] | null>(t.photoKinds) ?? [],
    version: t.version,
    updatedAt: t.updatedAt.toISOString(),
  }
}

function ownerOf(user: User): number {
  if (user.role !== 'asset_engineer') throw forbidden()
  return user.organisationId
}

/** The library of the engineer's organisation, by code; inactive ones only when asked. */
export async function listConditionTemplates(
  user: User,
  includeInactive = false,
): Promise<ConditionTemplateDto[]> {
  const where: Record<string, unknown> = { ownerOrganisationId: ownerOf(user) }
  if (!includeInactive) where.active = true
  const rows = await ConditionTemplate.findAll({ where, order: [['code', 'ASC']] })
  return rows.map(toConditionTemplateDto)
}

async function loadOwn(user: User, id: number, transaction?: Transaction) {
  const t = await ConditionTemplate.findByPk(id, { transaction })
  if (!t || t.ownerOrganisationId !== ownerOf(user)) throw notFound('library condition', id)
  return t
}

/** One library condition of the engineer's organisation. */
export async function getConditionTemplate(user: User, id: number): Promise<ConditionTemplateDto> {
  return toConditionTemplateDto(await loadOwn(user, id))
}

const duplicateCode = (code: string) =>
  conflict(`The library already has a condition with the code ${code}`, [
    { field: 'code', message: 'Already used in your library' },
  ])

/** Add a condition to the engineer's library. */
export async function createConditionTemplate(
  user: User,
  input: ConditionTemplateInput,
): Promise<ConditionTemplateDto> {
  const ownerOrganisationId = ownerOf(user)
  try {
    const t = await ConditionTemplate.create({
      ownerOrganisationId,
      code: input.code,
      title: input.title,
      text: input.text,
      parameters: input.parameters,
      active: input.active,
      attendanceNotice_h: input.attendanceNotice_h,
      photoKinds: input.photoKinds,
    })
    await recordAudit({
      actorUserId: user.id,
      action: 'condition-template-created',
      entityType: 'condition_template',
      entityId: t.id,
      details: { code: t.code },
    })
    return toConditionTemplateDto(t)
  } catch (err) {
    if (err instanceof UniqueConstraintError) throw duplicateCode(input.code)
    throw err
  }
}

/** Change a library condition; 409 when somebody changed it since `version` was loaded. */
export async function updateConditionTemplate(
  user: User,
  id: number,
  input: ConditionTemplateUpdate,
): Promise<ConditionTemplateDto> {
  await loadOwn(user, id)
  try {
    const [changed] = await ConditionTemplate.update(
      {
        code: input.code,
        title: input.title,
        text: input.text,
        parameters: input.parameters,
        active: input.active,
        attendanceNotice_h: input.attendanceNotice_h,
        photoKinds: input.photoKinds,
        version: input.version + 1,
      },
      { where: { id, version: input.version } },
    )
    if (changed === 0) throw conflict('Somebody changed this condition after you opened it; reload')
  } catch (err) {
    if (err instanceof UniqueConstraintError) throw duplicateCode(input.code)
    throw err
  }
  await recordAudit({
    actorUserId: user.id,
    action: 'condition-template-updated',
    entityType: 'condition_template',
    entityId: id,
    details: { code: input.code, version: input.version + 1 },
  })
  return toConditionTemplateDto(await loadOwn(user, id))
}

/**
 * Take a condition out of the library. It is kept (inactive) because decisions that used it
 * keep its id; it no longer appears in the library list.
 */
export async function retireConditionTemplate(user: User, id: number): Promise<void> {
  const t = await loadOwn(user, id)
  await t.update({ active: false, version: t.version + 1 })
  await recordAudit({
    actorUserId: user.id,
    action: 'condition-template-retired',
    entityType: 'condition_template',
    entityId: id,
    details: { code: t.code },
  })
}

const formatValue = (v: number | string) =>
  typeof v === 'number' ? String(Math.round(v * 1000) / 1000) : v

/**
 * Turn the conditions an engineer sends into the decided conditions: library ones get their
 * text filled in from the template and the parameter values (defaults where none is given,
 * each checked against its kind and range); engine and own conditions keep the text sent.
 * Field issues name `conditions.<i>.<field>`.
 */
export async function resolveDecidedConditions(
  ownerOrganisationId: number,
  inputs: readonly DecidedConditionInput[],
  transaction?: Transaction,
): Promise<DecidedCondition[]> {
  const issues: FieldIssue[] = []
  const out: DecidedCondition[] = []
  for (const [i, c] of inputs.entries()) {
    const at = (f: string) => `conditions.${i}.${f}`
    if (c.source !== 'library') {
      out.push({
        code: c.code,
        text: c.text!,
        source: c.source,
        reason: c.reason ?? null,
        templateId: null,
        parameters: c.parameters ?? null,
      })
      continue
    }
    const t = await ConditionTemplate.findByPk(c.templateId!, { transaction })
    if (!t || t.ownerOrganisationId !== ownerOrganisationId || !t.active) {
      issues.push({ field: at('templateId'), message: 'Not a condition of your library' })
      continue
    }
    const defs = toConditionTemplateDto(t).parameters
    const values: Record<string, number | string> = {}
    for (const d of defs) {
      const given = c.parameters?.[d.name]
      const v = given ?? d.default
      if (v === null || v === undefined || v === '') {
        issues.push({ field: at(`parameters.${d.name}`), message: `Enter ${d.label}` })
        continue
      }
      if (d.kind === 'number') {
        if (typeof v !== 'number' || !Number.isFinite(v)) {
          issues.push({ field: at(`parameters.${d.name}`), message: 'Enter a number' })
          continue
        }
        if (d.min !== undefined && v < d.min) {
          issues.push({
            field: at(`parameters.${d.name}`),
            message: `Must be at least ${d.min} ${d.unit}`.trim(),
          })
          continue
        }
        if (d.max !== undefined && v > d.max) {
          issues.push({
            field: at(`parameters.${d.name}`),
            message: `Must be at most ${d.max} ${d.unit}`.trim(),
          })
          continue
        }
      }
      values[d.name] = v
    }
    for (const name of Object.keys(c.parameters ?? {})) {
      if (!defs.some((d) => d.name === name)) {
        issues.push({
          field: at(`parameters.${name}`),
          message: 'This condition has no such parameter',
        })
      }
    }
    const text = t.text.replace(/\{([a-zA-Z0-9_]+)\}/g, (m, name: string) =>
      values[name] === undefined ? m : formatValue(values[name]!),
    )
    out.push({
      code: c.code || t.code,
      text,
      source: 'library',
      reason: c.reason ?? null,
      templateId: t.id,
      parameters: values,
    })
  }
  if (issues.length) throw validationFailed(issues)
  return out
}
