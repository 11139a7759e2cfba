/** Fee computation: pure functions over a schedule version, amounts in whole cents. */
export { applicationFee, changeFee } from './application-fee.ts'
export {
  durationClassOf,
  worksWorkingDays,
  MINOR_MAX_WORKING_DAYS,
  STANDARD_MAX_WORKING_DAYS,
} from './duration-class.ts'
export { formatAmount } from './money.ts'
export { refundAmount_cents } from './refund.ts'
export { effectiveUntil, scheduleInForce } from './schedule-in-force.ts'
