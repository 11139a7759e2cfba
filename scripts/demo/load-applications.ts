/**
 * Plays the demo applications of demo/applications.json through the real services, as the
 * people of the demo would: the contractor drafts and submits, the owners' engineers decide,
 * the permit office grants. Dates are counted from the day the demo is loaded, so the works
 * always lie ahead. Each application's `story` says how far it goes.
 */
import { readFileSync } from 'node:fs'
import { join } from 'node:path'
import { addDays, format } from 'date-fns'
import type { Sequelize } from 'sequelize'
import type { ActivityInput } from '../../shared/schemas/application.ts'
import type { ConditionTemplateInput } from '../../shared/schemas/condition-templates.ts'
import type { ReviewDecisionInput } from '../../shared/schemas/reviews.ts'
import { Application, Organisation, OwnerReview, User } from '../../server/models/index.ts'
import { createDraft, submitApplication } from '../../server/services/applications.ts'
import { createConditionTemplate } from '../../server/services/condition-templates.ts'
import { grantPermit } from '../../server/services/permit-office.ts'
import { decideReview } from '../../server/services/reviews.ts'

type Story = 'draft' | 'submitted' | 'waiting' | 'question' | 'objected' | 'granted'

interface DemoApplication {
  key: string
  applicant: string
  title: string
  siteAddress: string
  contactName: string
  contactPhone: string
  startsInDays: number
  days: number
  description: string
  activities: ActivityInput[]
  story: Story
}

/** The condition each owner keeps in its library for works near its mains. */
const LIBRARY: Record<'water' | 'gas', ConditionTemplateInput> = {
  water: {
    code: 'hand-dig-near-main',
    title: 'Hand digging near the water main',
    text: 'Within {distance_m} m of the water main, dig by hand or by vacuum excavation only.',
    parameters: [
      {
        name: 'distance_m',
        label: 'Distance from the main',
        unit: 'm',
        kind: 'number',
        default: 1,
        min: 0.5,
        max: 5,
      },
    ],
    active: true,
    attendanceNotice_h: null,
    photoKinds: ['reinstatement'],
  },
  gas: {
    code: 'trial-hole-before-work',
    title: 'Trial hole before work starts',
    text: 'Expose the gas main by a hand-dug trial hole and confirm its depth before any machine works within {distance_m} m.',
    parameters: [
      {
        name: 'distance_m',
        label: 'Distance from the main',
        unit: 'm',
        kind: 'number',
        default: 3,
        min: 1,
        max: 10,
      },
    ],
    active: true,
    attendanceNotice_h: 48,
    photoKinds: ['trial_holes'],
  },
}

const QUESTION =
  'Two of the outriggers stand over our 720 mm concrete sewer. Please send the lift plan with ' +
  'the crane model, the largest outrigger load and the mat size, and say whether the crane ' +
  'can stand on the far side of the road.'
const OBJECTION =
  'An unsupported excavation 3.2 m deep this close to the trunk main would undermine it and ' +
  'take away its side support. Please resubmit with sheet piling, or move the excavation so ' +
  'that it stays outside the main’s zone of influence.'

async function userByEmail(email: string): Promise<User> {
  const u = await User.findOne({ where: { email } })
  if (!u) throw new Error(`demo application: no user ${email}`)
  return u
}

async function engineerOf(organisationId: number): Promise<User> {
  const u = await User.findOne({ where: { organisationId, role: 'asset_engineer' } })
  if (!u) throw new Error(`demo application: organisation ${organisationId} has no engineer`)
  return u
}

async function openReviews(applicationId: number): Promise<OwnerReview[]> {
  return OwnerReview.findAll({ where: { applicationId, state: 'waiting' }, order: [['id', 'ASC']] })
}

/** Loads every demo application; returns how many reached each story. */
export async function loadDemoApplications(
  sequelize: Sequelize,
  demoDir: string,
  now = new Date(),
): Promise<Record<Story, number>> {
  const { applications } = JSON.parse(readFileSync(join(demoDir, 'applications.json'), 'utf8')) as {
    applications: DemoApplication[]
  }
  const counts: Record<Story, number> = {
    draft: 0,
    submitted: 0,
    waiting: 0,
    question: 0,
    objected: 0,
    granted: 0,
  }
  const day = (n: number) => format(addDays(now, n), 'yyyy-MM-dd')
  const templates = new Map<number, { id: number; code: string }>()
  const officer = await User.findOne({ where: { role: 'permit_officer' } })
  if (!officer) throw new Error('demo application: no permit officer')

  /** The owner's library condition, created the first time an owner needs it. */
  async function libraryTemplateOf(engineer: User): Promise<{ id: number; code: string }> {
    const known = templates.get(engineer.organisationId)
    if (known) return known
    const owner = await Organisation.findByPk(engineer.organisationId)
    const t = await createConditionTemplate(
      engineer,
      LIBRARY[owner?.medium === 'gas' ? 'gas' : 'water'],
    )
    const made = { id: t.id, code: t.code }
    templates.set(engineer.organisationId, made)
    return made
  }

  for (const d of applications) {
    const applicant = await userByEmail(d.applicant)
    const draft = await createDraft(sequelize, applicant, {
      title: d.title,
      siteAddress: d.siteAddress,
      contactName: d.contactName,
      contactPhone: d.contactPhone,
      startsOn: day(d.startsInDays),
      endsOn: day(d.startsInDays + d.days - 1),
      description: d.description,
      activities: d.activities,
    })
    counts[d.story]++
    if (d.story === 'draft') continue
    await submitApplication(sequelize, applicant, draft.id, draft.version, now)
    const reviews = await openReviews(draft.id)

    for (const [i, r] of reviews.entries()) {
      const engineer = await engineerOf(r.ownerOrganisationId)
      let decision: ReviewDecisionInput | null = null
      if (d.story === 'granted') {
        const template = await libraryTemplateOf(engineer)
        decision = {
          decision: 'accepted_with_conditions',
          version: r.version,
          reasons: 'Acceptable with the main protected while the trench is open.',
          conditions: [
            {
              source: 'library',
              code: template.code,
              templateId: template.id,
              parameters: { distance_m: 1 },
            },
          ],
        }
      } else if (d.story === 'question' && i === 0) {
        decision = { decision: 'information_requested', version: r.version, question: QUESTION }
      } else if (d.story === 'objected' && i === 0) {
        decision = { decision: 'objected', version: r.version, reasons: OBJECTION }
      }
      if (decision) await decideReview(sequelize, engineer, r.id, decision, now)
    }

    if (d.story === 'granted') {
      const a = await Application.findByPk(draft.id)
      if (a?.status !== 'ready_for_decision') {
        throw new Error(`demo application ${d.key}: not ready for decision (${a?.status})`)
      }
      await grantPermit(sequelize, officer, a.id, { version: a.version }, now)
    }
  }
  return counts
}
