import { DataTypes, Model, type Sequelize } from "sequelize";

/** A message received by the local fake SMTP server: the outbox admins can read. */
export class MailMessage extends Model {
  declare id: string;
  declare fromAddress: string;
  declare toAddresses: string;
  declare subject: string;
  declare textBody: string;
  declare htmlBody: string | null;
  declare createdAt: Date;
}

export function initMailMessage(sequelize: Sequelize) {
  MailMessage.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      fromAddress: { type: DataTypes.STRING(254), allowNull: false, field: "from_address" },
      toAddresses: { type: DataTypes.TEXT, allowNull: false, field: "to_addresses" },
      subject: { type: DataTypes.STRING(300), allowNull: false },
      textBody: { type: DataTypes.TEXT, allowNull: false, field: "text_body" },
      htmlBody: { type: DataTypes.TEXT, allowNull: true, field: "html_body" },
    },
    { sequelize, tableName: "mail_messages", underscored: true, updatedAt: false },
  );
}
