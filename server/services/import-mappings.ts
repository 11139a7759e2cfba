import { DEFAULT_IMPORT_MAPPING, importMappingSchema } from '../../shared/schemas/import-mapping.ts'
import type { ImportMapping as ImportMappingValue } from '../../shared/schemas/import-mapping.ts'
import { ImportMapping } from '../models/index.ts'
import { recordAudit } from './audit.ts'

/** The owner's saved import mapping, or the default (every field read from its own name). */
export async function getImportMapping(ownerOrganisationId: number): Promise<ImportMappingValue> {
  const row = await ImportMapping.findOne({ where: { ownerOrganisationId } })
  // Parse again so a mapping saved by an older version gains any newer defaults.
  return row ? importMappingSchema.parse(row.mapping) : DEFAULT_IMPORT_MAPPING
}

/** Save the owner's import mapping (validated by the caller), audited; returns it. */
export async function saveImportMapping(
  ownerOrganisationId: number,
  mapping: ImportMappingValue,
  actorUserId: number,
): Promise<ImportMappingValue> {
  const existing = await ImportMapping.findOne({ where: { ownerOrganisationId } })
  if (existing) await existing.update({ mapping, updatedByUserId: actorUserId })
  else await ImportMapping.create({ ownerOrganisationId, mapping, updatedByUserId: actorUserId })
  await recordAudit({
    actorUserId,
    action: 'network.mapping.saved',
    entityType: 'organisation',
    entityId: ownerOrganisationId,
    details: { mapping },
  })
  return mapping
}
