import { z } from 'zod'
import { PIPE_MEDIA } from '../types/network.ts'

/**
 * A network owner's import mapping: which source attribute (GeoJSON property or CSV column)
 * feeds which segment field, and how the owner's files write units and numbers. A field left
 * unmapped is read from the attribute of the same name as the field (`outerDiameter_m`), so a
 * file written by our own export needs no mapping at all.
 */

/** Segment fields a mapping can fill (the names of PipeSegmentData). */
export const MAPPABLE_FIELDS = [
  'ownerRef',
  'medium',
  'material',
  'outerDiameter_m',
  'wallThickness_m',
  'shortTermModulus_MPa',
  'longTermModulus_MPa',
  'allowableStress_MPa',
  'crushingStrength_kN_per_m',
  'beddingFactor',
  'crushingSafetyFactor',
  'internalPressure_kPa',
  'coverStart_m',
  'coverEnd_m',
  'installation',
  'trenchWidth_m',
  'wallFrictionKMu',
  'backfillUnitWeight_kN_per_m3',
  'frictionAngle_deg',
  'sidefillModulus_MPa',
  'beddingAngle_deg',
  'groundwaterAboveCrown_m',
  'designTrafficPressure_kPa',
  'deflectionLagFactor',
  'deflectionLimit_pct',
  'yearLaid',
  'positionalAccuracy_m',
  'positionalQuality',
] as const
export type MappableField = (typeof MAPPABLE_FIELDS)[number]

const MATERIALS = [
  'PE100',
  'PVC-U',
  'GRP',
  'steel',
  'ductile-iron',
  'concrete',
  'vitrified-clay',
] as const

const attributeName = z.string().trim().min(1).max(120)

export const importMappingSchema = z.object({
  /** Target field -> source attribute name. */
  fields: z.partialRecord(z.enum(MAPPABLE_FIELDS), attributeName).default({}),
  /** Unit the source writes outer diameter and wall thickness in (converted to metres). */
  diameterUnit: z.enum(['m', 'mm']).default('m'),
  wallThicknessUnit: z.enum(['m', 'mm']).default('m'),
  /** Unit the source writes internal pressure in (converted to kPa). */
  pressureUnit: z.enum(['kPa', 'bar', 'MPa']).default('kPa'),
  /** Source values -> our material names, e.g. { "PE": "PE100", "GGG": "ductile-iron" }. */
  materialValues: z.record(attributeName, z.enum(MATERIALS)).default({}),
  /** Source values -> our media, e.g. { "TW": "water" }. */
  mediumValues: z.record(attributeName, z.enum(PIPE_MEDIA)).default({}),
  /** Medium for features that name none (a gas owner's file rarely says "gas" on every pipe). */
  defaultMedium: z.enum(PIPE_MEDIA).nullable().default(null),
  csv: z
    .object({
      delimiter: z.enum([',', ';', '\t', '|']).default(','),
      /** Column that holds the WKT LINESTRING in WGS84 lon/lat. */
      wktColumn: attributeName.default('wkt'),
      /** Numbers written with a decimal comma ("0,4"). */
      decimalComma: z.boolean().default(false),
    })
    .prefault({}),
})
export type ImportMapping = z.infer<typeof importMappingSchema>
export type ImportMappingInput = z.input<typeof importMappingSchema>

/** The mapping an owner has before saving one. */
export const DEFAULT_IMPORT_MAPPING: ImportMapping = importMappingSchema.parse({})
