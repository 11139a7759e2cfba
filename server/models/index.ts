import type { Sequelize } from 'sequelize'
import { AuditEvent } from './audit-event.ts'
import { Organisation } from './organisation.ts'
import { User } from './user.ts'

export { AuditEvent, Organisation, User }

let initialised: Sequelize | undefined

/** Register every model and its associations on one Sequelize instance (once per process). */
export function initModels(sequelize: Sequelize): void {
  if (initialised === sequelize) return
  Organisation.initModel(sequelize)
  User.initModel(sequelize)
  AuditEvent.initModel(sequelize)
  Organisation.hasMany(User, { foreignKey: 'organisationId', as: 'users' })
  User.belongsTo(Organisation, { foreignKey: 'organisationId', as: 'organisation' })
  AuditEvent.belongsTo(User, { foreignKey: 'actorUserId', as: 'actor' })
  initialised = sequelize
}
