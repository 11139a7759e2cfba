import { describe, expect, it } from 'vitest'
import {
  applicationFee,
  changeFee,
  durationClassOf,
  effectiveUntil,
  formatAmount,
  refundAmount_cents,
  scheduleInForce,
  worksWorkingDays,
} from '../../../shared/fees/index.ts'
import type { FeeScheduleTerms } from '../../../shared/types/fees.ts'
import { DURATION_CLASSES, FEE_ACTIVITY_KINDS } from '../../../shared/types/fees.ts'

const none = new Set<string>()

/** A schedule of our own whose prices make each class and kind tell apart. */
function schedule(
  effectiveFrom: string,
  base_cents: number,
  extra: Partial<FeeScheduleTerms> = {},
): FeeScheduleTerms {
  const entries = DURATION_CLASSES.flatMap((d, i) =>
    FEE_ACTIVITY_KINDS.map((k, j) => ({
      durationClass: d,
      activityKind: k,
      amount_cents: base_cents + 1000 * i + 100 * j,
    })),
  )
  return {
    effectiveFrom,
    currency: 'EUR',
    entries,
    variationFee_cents: 4500,
    extensionFee_cents: 3000,
    refundBeforeReview_percent: 100,
    refundAfterReview_percent: 50,
    defaultPaymentTerms: 'pay_before_grant',
    ...extra,
  }
}

describe('worksWorkingDays and durationClassOf', () => {
  // Calendar facts: 2027-03-01 is a Monday.
  it('counts both the start and the end day and skips weekends and holidays', () => {
    expect(worksWorkingDays('2027-03-01', '2027-03-01', none)).toBe(1)
    expect(worksWorkingDays('2027-03-01', '2027-03-03', none)).toBe(3)
    expect(worksWorkingDays('2027-03-01', '2027-03-08', none)).toBe(6)
    expect(worksWorkingDays('2027-03-01', '2027-03-08', new Set(['2027-03-02']))).toBe(5)
    expect(worksWorkingDays('2027-03-06', '2027-03-07', none)).toBe(1) // a weekend still occupies the street
  })

  it('puts 3 working days in short works, 4 to 10 in medium, 11 and more in long works', () => {
    expect(durationClassOf(1)).toBe('minor')
    expect(durationClassOf(3)).toBe('minor')
    expect(durationClassOf(4)).toBe('standard')
    expect(durationClassOf(10)).toBe('standard')
    expect(durationClassOf(11)).toBe('major')
  })

  it('rejects an end before the start and a non-whole day count', () => {
    expect(() => worksWorkingDays('2027-03-05', '2027-03-01', none)).toThrow(/endsOn/)
    expect(() => durationClassOf(2.5)).toThrow(/workingDays/)
  })
})

describe('scheduleInForce', () => {
  const versions = [
    schedule('2026-01-01', 10_000),
    schedule('2027-04-01', 12_000),
    schedule('2027-01-01', 11_000),
  ]

  it('when the submit date falls between versions, then the latest one started by that day applies', () => {
    expect(scheduleInForce(versions, '2026-12-31')?.effectiveFrom).toBe('2026-01-01')
    expect(scheduleInForce(versions, '2027-01-01')?.effectiveFrom).toBe('2027-01-01')
    expect(scheduleInForce(versions, '2027-03-31')?.effectiveFrom).toBe('2027-01-01')
    expect(scheduleInForce(versions, '2027-04-01')?.effectiveFrom).toBe('2027-04-01')
  })

  it('when no version had started, then there is none', () => {
    expect(scheduleInForce(versions, '2025-12-31')).toBeNull()
  })

  it('gives each version the day before the next as its last day', () => {
    expect(effectiveUntil(versions, '2026-01-01')).toBe('2026-12-31')
    expect(effectiveUntil(versions, '2027-01-01')).toBe('2027-03-31')
    expect(effectiveUntil(versions, '2027-04-01')).toBeNull()
  })
})

describe('applicationFee across a schedule change', () => {
  const versions = [schedule('2027-01-01', 10_000), schedule('2027-04-01', 20_000)]
  const works = {
    startsOn: '2027-05-03',
    endsOn: '2027-05-05', // Mon to Wed: short works
    activityKinds: ['excavation', 'excavation', 'crane'] as const,
    holidays: none,
  }

  it('when the same works are submitted before and after the change, then each uses the version in force on its submit date', () => {
    const before = applicationFee(scheduleInForce(versions, '2027-03-31')!, works)
    const after = applicationFee(scheduleInForce(versions, '2027-04-01')!, works)
    // minor excavation = base, minor crane = base + 100 (see schedule()).
    expect(before.amount_cents).toBe(2 * 10_000 + 10_100)
    expect(after.amount_cents).toBe(2 * 20_000 + 20_100)
    expect(before.durationClass).toBe('minor')
    expect(before.lines).toEqual([
      {
        description: '2 excavations, short works (up to 3 working days)',
        activityKind: 'excavation',
        count: 2,
        unit_cents: 10_000,
        amount_cents: 20_000,
      },
      {
        description: '1 crane set-up, short works (up to 3 working days)',
        activityKind: 'crane',
        count: 1,
        unit_cents: 10_100,
        amount_cents: 10_100,
      },
    ])
  })

  it('when the works last longer, then the longer class price applies', () => {
    const fee = applicationFee(versions[0]!, {
      ...works,
      endsOn: '2027-05-17',
      activityKinds: ['fill'],
    })
    expect(fee.workingDays).toBe(11)
    expect(fee.durationClass).toBe('major')
    expect(fee.amount_cents).toBe(10_000 + 2000 + 200)
  })

  it('when a schedule lacks a price, then it says which', () => {
    const s = {
      ...versions[0]!,
      entries: versions[0]!.entries.filter((e) => e.activityKind !== 'fill'),
    }
    expect(() => applicationFee(s, { ...works, activityKinds: ['fill'] })).toThrow(/fill in minor/)
  })

  it('charges the extension and variation fees of the version given', () => {
    expect(changeFee(versions[1]!, 'extension').amount_cents).toBe(3000)
    expect(changeFee(versions[1]!, 'variation').amount_cents).toBe(4500)
  })
})

describe('refundAmount_cents', () => {
  it('pays back the before-review share until an owner answered, then the after-review share, rounded down', () => {
    const s = schedule('2027-01-01', 1, {
      refundBeforeReview_percent: 100,
      refundAfterReview_percent: 33,
    })
    expect(refundAmount_cents(s, 30_100, false)).toBe(30_100)
    expect(refundAmount_cents(s, 30_100, true)).toBe(9933) // 9933.0 exactly
    expect(refundAmount_cents(s, 101, true)).toBe(33) // 33.33 rounded down
  })
})

describe('formatAmount', () => {
  it('writes whole cents with two decimals and the currency', () => {
    expect(formatAmount(12_345, 'eur')).toBe('EUR 123.45')
    expect(formatAmount(125_000, 'EUR')).toBe('EUR 1,250.00')
    expect(formatAmount(5, 'EUR')).toBe('EUR 0.05')
  })
})
