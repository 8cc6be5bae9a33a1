import { DataTypes, Model, type Sequelize } from "sequelize";

/** A one-time link to set a password; only the sha256 of the token is stored. */
export class Invite extends Model {
  declare id: string;
  declare userId: string;
  declare tokenHash: string;
  declare purpose: "invite" | "reset";
  declare expiresAt: Date;
  declare usedAt: Date | null;
  declare createdById: string | null;
  declare createdAt: Date;
}

export function initInvite(sequelize: Sequelize) {
  Invite.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      userId: { type: DataTypes.UUID, allowNull: false, field: "user_id" },
      tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true, field: "token_hash" },
      purpose: { type: DataTypes.STRING(10), allowNull: false, defaultValue: "invite" },
      expiresAt: { type: DataTypes.DATE, allowNull: false, field: "expires_at" },
      usedAt: { type: DataTypes.DATE, allowNull: true, field: "used_at" },
      createdById: { type: DataTypes.UUID, allowNull: true, field: "created_by_id" },
    },
    { sequelize, tableName: "invites", underscored: true, updatedAt: false },
  );
}
