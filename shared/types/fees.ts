import type { ActivityKind } from '../schemas/application.ts'

/**
 * Works duration classes by the number of working days the works take (start and end day
 * included). The bands follow the English permit schemes' activity classes (minor: 3 working
 * days or less; standard: 4 to 10; major: 11 or more) as summarised in shared/practice.md §1.3.
 */
export const DURATION_CLASSES = ['minor', 'standard', 'major'] as const
export type DurationClass = (typeof DURATION_CLASSES)[number]

export const DURATION_CLASS_LABELS: Record<DurationClass, string> = {
  minor: 'Short works (up to 3 working days)',
  standard: 'Medium works (4 to 10 working days)',
  major: 'Long works (11 working days or more)',
}

export const FEE_ACTIVITY_KINDS = [
  'excavation',
  'crane',
  'fill',
] as const satisfies readonly ActivityKind[]

/** How the applicant pays: online before the permit can be granted, or on an invoice later. */
export const PAYMENT_TERMS = ['pay_before_grant', 'invoice'] as const
export type PaymentTerms = (typeof PAYMENT_TERMS)[number]
export const PAYMENT_TERMS_LABELS: Record<PaymentTerms, string> = {
  pay_before_grant: 'Pay before the permit is granted',
  invoice: 'Invoice (the permit does not wait for payment)',
}

/** What a fee is for. */
export const FEE_PURPOSES = ['application', 'extension', 'variation'] as const
export type FeePurpose = (typeof FEE_PURPOSES)[number]
export const FEE_PURPOSE_LABELS: Record<FeePurpose, string> = {
  application: 'Permit application',
  extension: 'Extension of the permit',
  variation: 'Variation of the permit',
}

/** Where a fee stands. */
export const FEE_STATES = [
  'due',
  'paid',
  'refund_due',
  'refunded',
  'cancelled',
  'no_charge',
] as const
export type FeeState = (typeof FEE_STATES)[number]
export const FEE_STATE_LABELS: Record<FeeState, string> = {
  due: 'To pay',
  paid: 'Paid',
  refund_due: 'Refund being paid back',
  refunded: 'Refunded',
  cancelled: 'Cancelled (nothing to pay)',
  no_charge: 'No charge',
}

/** One price of a schedule: an activity of this kind in works of this duration class. */
export interface FeeEntry {
  durationClass: DurationClass
  activityKind: ActivityKind
  amount_cents: number
}

/** The part of a schedule version the computation needs. */
export interface FeeScheduleTerms {
  effectiveFrom: string
  currency: string
  entries: FeeEntry[]
  variationFee_cents: number
  extensionFee_cents: number
  /** Share of a paid application fee paid back when the application closes before any owner has answered. */
  refundBeforeReview_percent: number
  /** Share paid back once an owner has answered (decision or question). */
  refundAfterReview_percent: number
  defaultPaymentTerms: PaymentTerms
}

export interface FeeScheduleDto extends FeeScheduleTerms {
  id: number
  authorityOrganisation: { id: number; name: string }
  /** The day before the next version takes over; null while no later version exists. */
  effectiveTo: string | null
  note: string | null
  createdBy: { id: number; name: string }
  createdAt: string
}

/** One line of a computed fee. */
export interface FeeLine {
  description: string
  activityKind: ActivityKind | null
  count: number
  unit_cents: number
  amount_cents: number
}

export interface ApplicationFeeBreakdown {
  durationClass: DurationClass
  workingDays: number
  lines: FeeLine[]
  amount_cents: number
}

export interface ReceiptDto {
  id: number
  number: string
  kind: 'payment' | 'refund'
  amount_cents: number
  currency: string
  issuedAt: string
  documentUrl: string
}

export interface ApplicationFeeDto {
  id: number
  applicationId: number
  purpose: FeePurpose
  state: FeeState
  amount_cents: number
  refunded_cents: number
  /** Refund that is owed but not yet confirmed paid back. */
  refundDue_cents: number
  currency: string
  paymentTerms: PaymentTerms
  lines: FeeLine[]
  durationClass: DurationClass | null
  workingDays: number | null
  schedule: { id: number; effectiveFrom: string; authorityName: string }
  refundRule: { beforeReview_percent: number; afterReview_percent: number }
  /** The last online payment attempt that did not go through, if the latest one failed. */
  lastAttemptFailed: boolean
  /** True when paid through the payment service (its refunds go back the same way). */
  paidOnline: boolean
  /** Reference of a payment or refund booked by the permit office (invoice, bank transfer). */
  offlineReference: string | null
  paidAt: string | null
  refundedAt: string | null
  createdAt: string
  receipts: ReceiptDto[]
}

export interface ApplicationFeesDto {
  fees: ApplicationFeeDto[]
  /** True while the permit may not be granted because a pay-before-grant fee is unpaid. */
  grantBlocked: boolean
  /** True when online payment is set up on this server. */
  onlinePayment: boolean
}
