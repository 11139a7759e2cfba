import type { Sequelize } from 'sequelize'
import type { ReviewAnswerInput } from '../../shared/schemas/reviews.ts'
import type { ApplicantReviewDto } from '../../shared/types/reviews.ts'
import { OPEN_REVIEW_STATES } from '../../shared/types/reviews.ts'
import { addWorkingDays } from '../../shared/time/working-days.ts'
import { config } from '../config.ts'
import { conflict, domainRule, forbidden, notFound, validationFailed } from '../errors.ts'
import { enqueueMail } from '../mail/outbox.ts'
import { answerReceivedMail } from '../mail/templates/answer-received.ts'
import {
  Application,
  ApplicationAttachment,
  Organisation,
  OwnerReview,
  ReviewMessage,
  ReviewMessageAttachment,
  User,
} from '../models/index.ts'
import { canRead } from './applications.ts'
import { recordAudit } from './audit.ts'
import { organisationEmails } from './mail-recipients.ts'
import { isoToday } from './review-clock.ts'
import { MESSAGE_INCLUDE, storedConditions, toMessageDto } from './review-dto.ts'
import { lockApplication } from './review-progress.ts'

/**
 * The owner reviews of an application as the applicant (or the permit office) sees them: per
 * affected owner the state, the due date, the decision once made (conditions' text, reasons)
 * and the question thread. Not-affected owners are left out; no design data is included.
 */
export async function listApplicationReviews(
  user: User,
  applicationId: number,
): Promise<ApplicantReviewDto[]> {
  const a = await Application.findByPk(applicationId)
  if (!a || !canRead(user, a)) throw notFound('application', applicationId)
  const reviews = await OwnerReview.findAll({
    where: { applicationId },
    include: [{ model: Organisation, as: 'owner', attributes: ['id', 'name'] }],
    order: [['id', 'ASC']],
  })
  const shown = reviews.filter((r) => r.state !== 'not_affected')
  const messages = shown.length
    ? await ReviewMessage.findAll({
        where: { reviewId: shown.map((r) => r.id) },
        include: MESSAGE_INCLUDE,
        order: [['id', 'ASC']],
      })
    : []
  return shown.map((r) => {
    const decided = !OPEN_REVIEW_STATES.includes(r.state)
    return {
      id: r.id,
      owner: { id: r.owner!.id, name: r.owner!.name },
      state: r.state,
      dueOn: r.pausedAt ? null : r.dueOn,
      paused: r.pausedAt !== null,
      decidedAt: decided && r.decidedAt ? r.decidedAt.toISOString() : null,
      reasons: decided || r.state === 'information_requested' ? r.reasons : null,
      conditions: decided
        ? storedConditions(r.conditions).map((c) => ({ code: c.code, text: c.text }))
        : [],
      messages: messages.filter((m) => m.reviewId === r.id).map(toMessageDto),
      awaitingAnswer: r.state === 'information_requested',
    }
  })
}

/**
 * The applicant answers an owner's open question. The review goes back to `waiting` and its
 * clock runs again with the working days it had left when the question was asked, counted
 * from today; the owner's engineers are told.
 */
export async function answerOwnerQuestion(
  sequelize: Sequelize,
  user: User,
  applicationId: number,
  reviewId: number,
  input: ReviewAnswerInput,
  now = new Date(),
): Promise<ApplicantReviewDto[]> {
  if (user.role !== 'applicant') throw forbidden()
  const cfg = config()
  await sequelize.transaction(async (transaction) => {
    const a = await lockApplication(applicationId, transaction)
    if (!a || !canRead(user, a)) throw notFound('application', applicationId)
    const r = await OwnerReview.findByPk(reviewId, {
      include: [{ model: Organisation, as: 'owner', attributes: ['id', 'name'] }],
      transaction,
      lock: transaction.LOCK.UPDATE,
    })
    if (!r || r.applicationId !== applicationId) throw notFound('review', reviewId)
    if (r.state !== 'information_requested') {
      throw domainRule('This owner has no open question to answer')
    }
    const dueOn = addWorkingDays(isoToday(now), r.remainingWorkingDays ?? 0, cfg.publicHolidays)
    const [changed] = await OwnerReview.update(
      {
        state: 'waiting',
        pausedAt: null,
        remainingWorkingDays: null,
        dueOn,
        version: r.version + 1,
      },
      { where: { id: r.id, version: r.version }, transaction },
    )
    if (changed === 0) throw conflict('The review changed meanwhile; reload and answer again')
    const attachmentIds = input.attachmentIds ?? []
    if (attachmentIds.length > 0) {
      const found = await ApplicationAttachment.count({
        where: { id: attachmentIds, applicationId },
        transaction,
      })
      if (found !== attachmentIds.length) {
        throw validationFailed([
          { field: 'attachmentIds', message: 'Choose documents of this application only' },
        ])
      }
    }
    const message = await ReviewMessage.create(
      {
        reviewId: r.id,
        kind: 'answer',
        body: input.body,
        authorUserId: user.id,
      },
      { transaction },
    )
    await ReviewMessageAttachment.bulkCreate(
      attachmentIds.map((id) => ({ reviewMessageId: message.id, applicationAttachmentId: id })),
      { transaction },
    )
    const mail = answerReceivedMail({
      publicUrl: cfg.publicUrl,
      reviewId: r.id,
      ownerName: r.owner!.name,
      reference: a.reference ?? `#${a.id}`,
      answer: input.body,
      dueOn,
    })
    for (const to of await organisationEmails(
      r.ownerOrganisationId,
      'asset_engineer',
      transaction,
    )) {
      await enqueueMail(
        { to: [to], ...mail, related: { type: 'owner_review', id: r.id } },
        transaction,
      )
    }
    await recordAudit(
      {
        actorUserId: user.id,
        action: 'review-question-answered',
        entityType: 'owner_review',
        entityId: r.id,
        details: {
          applicationId,
          ownerOrganisationId: r.ownerOrganisationId,
          dueOn,
          attachmentIds,
        },
      },
      transaction,
    )
  })
  return listApplicationReviews(user, applicationId)
}
