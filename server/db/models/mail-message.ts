import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** Where a recorded e-mail is: queued (or retrying), accepted by the mail server, or given up on. */
export type MailStatus = 'waiting' | 'sent' | 'failed';

/** An attachment as stored on the row (content base64, so the row is plain JSON). */
export interface StoredAttachment {
  filename: string;
  contentType?: string;
  contentBase64: string;
}

/** One e-mail the app sends: recorded first, then queued by id and sent by the mail worker. */
export class MailMessage extends Model<InferAttributes<MailMessage>, InferCreationAttributes<MailMessage>> {
  declare id: CreationOptional<string>;
  declare organisationId: string | null;
  declare jobId: string | null;
  /** The job's `email_sent` event, whose status follows this row's. */
  declare jobEventId: string | null;
  declare purpose: CreationOptional<string>;
  declare recipient: string;
  declare replyTo: string | null;
  declare subject: string;
  declare text: string;
  declare html: string | null;
  declare attachments: CreationOptional<StoredAttachment[]>;
  declare status: CreationOptional<MailStatus>;
  declare attempts: CreationOptional<number>;
  /** Why the last attempt failed (the mail server's answer), null once sent. */
  declare lastError: string | null;
  declare sentAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    MailMessage.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        organisationId: { type: DataTypes.UUID, allowNull: true },
        jobId: { type: DataTypes.UUID, allowNull: true },
        jobEventId: { type: DataTypes.UUID, allowNull: true },
        purpose: { type: DataTypes.STRING(40), allowNull: false, defaultValue: '' },
        recipient: { type: DataTypes.TEXT, allowNull: false },
        replyTo: { type: DataTypes.STRING(254), allowNull: true },
        subject: { type: DataTypes.TEXT, allowNull: false },
        text: { type: DataTypes.TEXT, allowNull: false },
        html: { type: DataTypes.TEXT, allowNull: true },
        attachments: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        status: { type: DataTypes.STRING(10), allowNull: false, defaultValue: 'waiting' },
        attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        lastError: { type: DataTypes.TEXT, allowNull: true },
        sentAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'mail_messages' },
    );
  }
}
