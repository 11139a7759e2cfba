import { DataTypes, Model } from 'sequelize'
import type {
  CreationOptional,
  InferAttributes,
  InferCreationAttributes,
  Sequelize,
} from 'sequelize'

/** A file attached to an outgoing mail, read from disk when the mail is sent. */
export interface OutboxAttachment {
  filename: string
  path: string
  contentType: string
}

/** One mail waiting in (or sent from) the outbox. */
export class OutboxMail extends Model<
  InferAttributes<OutboxMail>,
  InferCreationAttributes<OutboxMail>
> {
  declare id: CreationOptional<number>
  declare toAddress: string
  declare subject: string
  declare textBody: string
  declare htmlBody: string | null
  declare attachments: OutboxAttachment[] | null
  declare status: CreationOptional<'pending' | 'sent' | 'failed'>
  declare attempts: CreationOptional<number>
  declare nextAttemptAt: Date
  declare lockedBy: string | null
  declare lockedUntil: Date | null
  declare lastError: string | null
  declare relatedType: string | null
  declare relatedId: string | null
  declare sentAt: Date | null
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize): void {
    OutboxMail.init(
      {
        id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
        toAddress: { type: DataTypes.STRING(1000), allowNull: false },
        subject: { type: DataTypes.STRING(300), allowNull: false },
        textBody: { type: DataTypes.TEXT, allowNull: false },
        htmlBody: { type: DataTypes.TEXT, allowNull: true },
        attachments: { type: DataTypes.JSON, allowNull: true },
        status: {
          type: DataTypes.ENUM('pending', 'sent', 'failed'),
          allowNull: false,
          defaultValue: 'pending',
        },
        attempts: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        nextAttemptAt: { type: DataTypes.DATE(3), allowNull: false },
        lockedBy: { type: DataTypes.STRING(64), allowNull: true },
        lockedUntil: { type: DataTypes.DATE(3), allowNull: true },
        lastError: { type: DataTypes.STRING(1000), allowNull: true },
        relatedType: { type: DataTypes.STRING(64), allowNull: true },
        relatedId: { type: DataTypes.STRING(64), allowNull: true },
        sentAt: { type: DataTypes.DATE(3), allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: 'outbox_mails', underscored: true },
    )
  }
}
