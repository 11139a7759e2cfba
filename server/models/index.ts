import type { Sequelize } from 'sequelize'
import { Activity } from './activity.ts'
import { Application } from './application.ts'
import { ApplicationAttachment } from './application-attachment.ts'
import { Assessment } from './assessment.ts'
import { AuditEvent } from './audit-event.ts'
import { ImportMapping } from './import-mapping.ts'
import { NetworkImport } from './network-import.ts'
import { Organisation } from './organisation.ts'
import { OutboxMail } from './outbox-mail.ts'
import { PasswordReset } from './password-reset.ts'
import { PipeSegment } from './pipe-segment.ts'
import { User } from './user.ts'
import { ConditionTemplate } from './condition-template.ts'
import { ApplicationFee } from './application-fee.ts'
import { FeeSchedule } from './fee-schedule.ts'
import { PaymentEvent } from './payment-event.ts'
import { Receipt } from './receipt.ts'
import { OwnerReview } from './owner-review.ts'
import { Permit } from './permit.ts'
import { ReviewDecision } from './review-decision.ts'
import { ReviewMessage } from './review-message.ts'
import { ReviewMessageAttachment } from './review-message-attachment.ts'
import { SegmentRerun } from './segment-rerun.ts'
import { ChangeReview } from './change-review.ts'
import { EmergencyWorks } from './emergency-works.ts'
import { PermitChangeRequest } from './permit-change-request.ts'
import { SiteChecklist } from './site-checklist.ts'
import { SiteEvent } from './site-event.ts'
import { SitePhoto } from './site-photo.ts'

export {
  Activity,
  Application,
  ApplicationAttachment,
  Assessment,
  AuditEvent,
  ImportMapping,
  NetworkImport,
  Organisation,
  OutboxMail,
  PasswordReset,
  PipeSegment,
  User,
}

export {
  ConditionTemplate,
  OwnerReview,
  Permit,
  ReviewDecision,
  ReviewMessage,
  ReviewMessageAttachment,
  SegmentRerun,
}
export { ApplicationFee, FeeSchedule, PaymentEvent, Receipt }

export { ChangeReview, EmergencyWorks, PermitChangeRequest, SiteChecklist, SiteEvent, SitePhoto }

let initialised: Sequelize | undefined

/** Register every model and its associations on one Sequelize instance (once per process). */
export function initModels(sequelize: Sequelize): void {
  if (initialised === sequelize) return
  Organisation.initModel(sequelize)
  User.initModel(sequelize)
  AuditEvent.initModel(sequelize)
  PipeSegment.initModel(sequelize)
  ImportMapping.initModel(sequelize)
  NetworkImport.initModel(sequelize)
  Application.initModel(sequelize)
  Activity.initModel(sequelize)
  ApplicationAttachment.initModel(sequelize)
  Assessment.initModel(sequelize)
  OutboxMail.initModel(sequelize)
  PasswordReset.initModel(sequelize)
  Organisation.hasMany(User, { foreignKey: 'organisationId', as: 'users' })
  User.belongsTo(Organisation, { foreignKey: 'organisationId', as: 'organisation' })
  AuditEvent.belongsTo(User, { foreignKey: 'actorUserId', as: 'actor' })
  PipeSegment.belongsTo(Organisation, { foreignKey: 'ownerOrganisationId', as: 'owner' })
  NetworkImport.belongsTo(Organisation, { foreignKey: 'ownerOrganisationId', as: 'owner' })
  Application.hasMany(Activity, { foreignKey: 'applicationId', as: 'activities' })
  Activity.belongsTo(Application, { foreignKey: 'applicationId', as: 'application' })
  Application.belongsTo(Organisation, {
    foreignKey: 'applicantOrganisationId',
    as: 'applicantOrganisation',
  })
  Application.belongsTo(User, { foreignKey: 'createdByUserId', as: 'createdBy' })
  Application.hasMany(Assessment, { foreignKey: 'applicationId', as: 'assessments' })
  Assessment.belongsTo(Application, { foreignKey: 'applicationId', as: 'application' })
  Assessment.belongsTo(PipeSegment, { foreignKey: 'pipeSegmentId', as: 'segment' })
  OwnerReview.initModel(sequelize)
  ReviewDecision.initModel(sequelize)
  ReviewMessage.initModel(sequelize)
  ReviewMessageAttachment.initModel(sequelize)
  ConditionTemplate.initModel(sequelize)
  SegmentRerun.initModel(sequelize)
  Permit.initModel(sequelize)
  OwnerReview.belongsTo(Organisation, { foreignKey: 'ownerOrganisationId', as: 'owner' })
  OwnerReview.belongsTo(Application, { foreignKey: 'applicationId', as: 'application' })
  ReviewDecision.belongsTo(User, { foreignKey: 'decidedByUserId', as: 'decidedBy' })
  ReviewMessage.belongsTo(User, { foreignKey: 'authorUserId', as: 'author' })
  ReviewMessage.belongsToMany(ApplicationAttachment, {
    through: ReviewMessageAttachment,
    foreignKey: 'reviewMessageId',
    otherKey: 'applicationAttachmentId',
    as: 'attachments',
  })
  SegmentRerun.belongsTo(User, { foreignKey: 'createdByUserId', as: 'createdBy' })
  Permit.belongsTo(User, { foreignKey: 'issuedByUserId', as: 'issuedBy' })
  Permit.belongsTo(Application, { foreignKey: 'applicationId', as: 'application' })
  FeeSchedule.initModel(sequelize)
  ApplicationFee.initModel(sequelize)
  PaymentEvent.initModel(sequelize)
  Receipt.initModel(sequelize)
  FeeSchedule.belongsTo(Organisation, { foreignKey: 'authorityOrganisationId', as: 'authority' })
  FeeSchedule.belongsTo(User, { foreignKey: 'createdByUserId', as: 'createdBy' })
  ApplicationFee.belongsTo(FeeSchedule, { foreignKey: 'feeScheduleId', as: 'schedule' })
  SiteEvent.initModel(sequelize)
  SitePhoto.initModel(sequelize)
  SiteChecklist.initModel(sequelize)
  PermitChangeRequest.initModel(sequelize)
  ChangeReview.initModel(sequelize)
  EmergencyWorks.initModel(sequelize)
  SiteEvent.belongsTo(User, { foreignKey: 'recordedByUserId', as: 'recordedBy' })
  PermitChangeRequest.hasMany(ChangeReview, { foreignKey: 'changeRequestId', as: 'reviews' })
  ChangeReview.belongsTo(Organisation, { foreignKey: 'ownerOrganisationId', as: 'owner' })
  EmergencyWorks.belongsTo(Organisation, {
    foreignKey: 'applicantOrganisationId',
    as: 'applicantOrganisation',
  })
  initialised = sequelize
}
