import type { Transaction } from 'sequelize'
import { AuditEvent, User } from '../models/index.ts'

export interface AuditInput {
  actorUserId: number | null
  action: string
  entityType: string
  entityId?: string | number | null
  details?: Record<string, unknown> | null
  ip?: string | null
}

export interface AuditEventDto {
  id: number
  at: string
  actor: { id: number; name: string; email: string } | null
  action: string
  entityType: string
  entityId: string | null
  details: Record<string, unknown> | null
}

/** Append one event to the audit trail, inside the caller's transaction when given. */
export async function recordAudit(input: AuditInput, transaction?: Transaction): Promise<void> {
  await AuditEvent.create(
    {
      at: new Date(),
      actorUserId: input.actorUserId,
      action: input.action,
      entityType: input.entityType,
      entityId: input.entityId == null ? null : String(input.entityId),
      details: input.details ?? null,
      ip: input.ip ?? null,
    },
    { transaction },
  )
}

/** A page of audit events, newest first, optionally for one record. */
export async function listAudit(opts: {
  page: number
  pageSize: number
  entityType?: string
  entityId?: string
}): Promise<{ items: AuditEventDto[]; total: number }> {
  const where: Record<string, string> = {}
  if (opts.entityType) where.entityType = opts.entityType
  if (opts.entityId) where.entityId = opts.entityId
  const { rows, count } = await AuditEvent.findAndCountAll({
    where,
    include: [{ model: User, as: 'actor', attributes: ['id', 'name', 'email'] }],
    order: [['id', 'DESC']],
    limit: opts.pageSize,
    offset: (opts.page - 1) * opts.pageSize,
  })
  return {
    total: count,
    items: rows.map((e) => ({
      id: Number(e.id),
      at: e.at.toISOString(),
      actor: e.actor ? { id: e.actor.id, name: e.actor.name, email: e.actor.email } : null,
      action: e.action,
      entityType: e.entityType,
      entityId: e.entityId,
      details: e.details,
    })),
  }
}
