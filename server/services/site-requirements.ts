import { Op } from 'sequelize'
import type { Transaction } from 'sequelize'
import type { PermitCondition } from '../../shared/types/permits.ts'
import type {
  AttendingOwner,
  RequiredPhotoKind,
  SiteRequirements,
} from '../../shared/types/site-works.ts'
import { REQUIRED_PHOTO_KINDS } from '../../shared/types/site-works.ts'
import { ConditionTemplate, Organisation } from '../models/index.ts'
import { parseJson } from './review-dto.ts'

/**
 * What a permit's conditions ask of the site. A condition an owner set from its library
 * carries the library condition's code; the library condition says whether the owner attends
 * (with its notice in hours) and which photos it wants. Conditions written freely ask nothing
 * of this kind. Where several conditions of one owner ask for attendance, the longest notice
 * counts.
 */
export async function siteRequirements(
  conditions: readonly PermitCondition[],
  transaction?: Transaction,
): Promise<SiteRequirements> {
  const pairs = conditions
    .filter((c) => c.ownerOrganisationId != null)
    .map((c) => ({ ownerOrganisationId: c.ownerOrganisationId!, code: c.code }))
  const templates = pairs.length
    ? await ConditionTemplate.findAll({
        where: { [Op.or]: pairs },
        attributes: ['ownerOrganisationId', 'code', 'attendanceNotice_h', 'photoKinds'],
        transaction,
      })
    : []
  const attendance = new Map<number, { notice_h: number; codes: string[] }>()
  const photos = new Set<RequiredPhotoKind>()
  for (const t of templates) {
    if (t.attendanceNotice_h) {
      const prev = attendance.get(t.ownerOrganisationId)
      if (!prev)
        attendance.set(t.ownerOrganisationId, { notice_h: t.attendanceNotice_h, codes: [t.code] })
      else {
        prev.notice_h = Math.max(prev.notice_h, t.attendanceNotice_h)
        prev.codes.push(t.code)
      }
    }
    for (const k of parseJson<RequiredPhotoKind[] | null>(t.photoKinds) ?? []) photos.add(k)
  }
  const names = new Map(
    attendance.size
      ? (
          await Organisation.findAll({
            where: { id: { [Op.in]: [...attendance.keys()] } },
            attributes: ['id', 'name'],
            transaction,
          })
        ).map((o) => [o.id, o.name])
      : [],
  )
  const list: AttendingOwner[] = [...attendance]
    .map(([id, a]) => ({
      owner: { id, name: names.get(id) ?? `Owner ${id}` },
      notice_h: a.notice_h,
      conditionCodes: a.codes.sort(),
    }))
    .sort((a, b) => a.owner.name.localeCompare(b.owner.name))
  return {
    attendance: list,
    notice_h: list.reduce((m, a) => Math.max(m, a.notice_h), 0),
    photoKinds: REQUIRED_PHOTO_KINDS.filter((k) => photos.has(k)),
  }
}
