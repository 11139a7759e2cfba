import type { FeeScheduleInput, PaymentTermsInput } from '../../shared/schemas/fees.ts'
import type { ApplicationFeesDto, FeeScheduleDto } from '../../shared/types/fees.ts'
import { config } from '../config.ts'
import { http } from './http.ts'

export interface FeeScheduleList {
  versions: FeeScheduleDto[]
  inForceId: number | null
}

export function fetchFeeSchedules(): Promise<FeeScheduleList> {
  return http.get<FeeScheduleList>('/fee-schedules')
}

export function createFeeSchedule(input: FeeScheduleInput): Promise<FeeScheduleDto> {
  return http.post<FeeScheduleDto>('/fee-schedules', input)
}

export function fetchApplicationFees(applicationId: number): Promise<ApplicationFeesDto> {
  return http.get<ApplicationFeesDto>(`/applications/${applicationId}/fees`)
}

export function setPaymentTerms(
  applicationId: number,
  input: PaymentTermsInput,
): Promise<ApplicationFeesDto> {
  return http.put<ApplicationFeesDto>(`/applications/${applicationId}/fees/terms`, input)
}

/** Open a payment on the payment service; the browser then goes to the returned page. */
export function startCheckout(feeId: number): Promise<{ url: string }> {
  return http.post<{ url: string }>(`/fees/${feeId}/checkout`, {})
}

export function confirmCheckout(feeId: number): Promise<ApplicationFeesDto> {
  return http.post<ApplicationFeesDto>(`/fees/${feeId}/confirm`, {})
}

export function recordOfflinePayment(
  feeId: number,
  reference: string,
): Promise<ApplicationFeesDto> {
  return http.post<ApplicationFeesDto>(`/fees/${feeId}/record-payment`, { reference })
}

export function recordOfflineRefund(feeId: number, reference: string): Promise<ApplicationFeesDto> {
  return http.post<ApplicationFeesDto>(`/fees/${feeId}/record-refund`, { reference })
}

export function retryRefund(feeId: number): Promise<ApplicationFeesDto> {
  return http.post<ApplicationFeesDto>(`/fees/${feeId}/refund`, {})
}

/** Where the browser downloads a receipt PDF. */
export function receiptHref(documentUrl: string): string {
  return `${config.apiBase}${documentUrl.replace(/^\/api/, '')}`
}
