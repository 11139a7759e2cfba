import type { Sequelize } from 'sequelize'
import { Activity } from './activity.ts'
import { Application } from './application.ts'
import { AuditEvent } from './audit-event.ts'
import { Organisation } from './organisation.ts'
import { User } from './user.ts'

export { Activity, Application, AuditEvent, Organisation, User }

let initialised: Sequelize | undefined

/** Register every model and its associations on one Sequelize instance (once per process). */
export function initModels(sequelize: Sequelize): void {
  if (initialised === sequelize) return
  Organisation.initModel(sequelize)
  User.initModel(sequelize)
  AuditEvent.initModel(sequelize)
  Application.initModel(sequelize)
  Activity.initModel(sequelize)
  Organisation.hasMany(User, { foreignKey: 'organisationId', as: 'users' })
  User.belongsTo(Organisation, { foreignKey: 'organisationId', as: 'organisation' })
  AuditEvent.belongsTo(User, { foreignKey: 'actorUserId', as: 'actor' })
  Application.hasMany(Activity, { foreignKey: 'applicationId', as: 'activities' })
  Activity.belongsTo(Application, { foreignKey: 'applicationId', as: 'application' })
  Application.belongsTo(Organisation, { foreignKey: 'applicantOrganisationId', as: 'applicantOrganisation' })
  Application.belongsTo(User, { foreignKey: 'createdByUserId', as: 'createdBy' })
  initialised = sequelize
}
