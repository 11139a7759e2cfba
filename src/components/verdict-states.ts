import { matCheckCircle, matReport, matWarning } from '@quasar/extras/material-icons'

/** The three outcomes of a check. Each has its own shape, word and colour. */
export const VERDICTS = ['clear', 'conditional', 'critical'] as const
export type Verdict = (typeof VERDICTS)[number]

export interface VerdictLook {
  word: string
  /** One line on what the verdict means for the works. */
  meaning: string
  icon: string
  /** Quasar brand colour name. */
  colour: 'positive' | 'warning' | 'negative'
}

export const VERDICT_LOOKS: Record<Verdict, VerdictLook> = {
  clear: {
    word: 'Clear',
    meaning: 'Within limits under the stated assumptions',
    icon: matCheckCircle,
    colour: 'positive',
  },
  conditional: {
    word: 'Conditional',
    meaning: 'Acceptable only with the listed conditions',
    icon: matWarning,
    colour: 'warning',
  },
  critical: {
    word: 'Critical',
    meaning: 'Over a limit: the works need changing or protecting',
    icon: matReport,
    colour: 'negative',
  },
}
