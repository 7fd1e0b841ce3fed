import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

export class OutgoingEmail extends Model<
  InferAttributes<OutgoingEmail>,
  InferCreationAttributes<OutgoingEmail>
> {
  declare id: CreationOptional<number>;
  declare toAddress: string;
  declare subject: string;
  declare textBody: string;
  declare htmlBody: string;
  declare state: 'queued' | 'sent' | 'failed';
  declare attempts: CreationOptional<number>;
  declare lastError: string | null;
  declare nextAttemptAt: Date;
  declare sentAt: Date | null;
  declare relatedEntity: string | null;
  declare relatedId: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initOutgoingEmailModel(sequelize: Sequelize): void {
  OutgoingEmail.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      toAddress: { type: DataTypes.STRING(254), allowNull: false },
      subject: { type: DataTypes.STRING(300), allowNull: false },
      textBody: { type: DataTypes.TEXT, allowNull: false },
      htmlBody: { type: DataTypes.TEXT, allowNull: false },
      state: { type: DataTypes.STRING(8), allowNull: false },
      attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      lastError: DataTypes.TEXT,
      nextAttemptAt: { type: DataTypes.DATE(3), allowNull: false },
      sentAt: DataTypes.DATE(3),
      relatedEntity: DataTypes.STRING(32),
      relatedId: DataTypes.STRING(64),
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'outgoing_emails', underscored: true },
  );
}
