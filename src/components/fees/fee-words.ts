import type { ActivityKind } from '../../../shared/schemas/application.ts'

/** Activity kinds as column heads of a fee table, per activity. */
export const FEE_KIND_LABELS: Record<ActivityKind, string> = {
  excavation: 'Excavation',
  crane: 'Crane set-up',
  fill: 'Fill or stockpile',
}

/** The refund rule in words, as shown to applicants and officers. */
export function refundRuleWords(before_percent: number, after_percent: number): string {
  return `If the application is refused or withdrawn, ${before_percent} % of a paid fee is paid back while no network owner has answered, ${after_percent} % once one has. Extension and variation fees are not paid back.`
}
