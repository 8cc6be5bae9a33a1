import { DataTypes, Model, type Sequelize } from "sequelize";

/** A personal token for scripts; only its sha256 is stored, the prefix helps users tell tokens apart. */
export class ApiToken extends Model {
  declare id: string;
  declare userId: string;
  declare name: string;
  declare prefix: string;
  declare tokenHash: string;
  declare lastUsedAt: Date | null;
  declare revokedAt: Date | null;
  declare createdAt: Date;
}

export function initApiToken(sequelize: Sequelize) {
  ApiToken.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      userId: { type: DataTypes.UUID, allowNull: false, field: "user_id" },
      name: { type: DataTypes.STRING(80), allowNull: false },
      prefix: { type: DataTypes.STRING(12), allowNull: false },
      tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true, field: "token_hash" },
      lastUsedAt: { type: DataTypes.DATE, allowNull: true, field: "last_used_at" },
      revokedAt: { type: DataTypes.DATE, allowNull: true, field: "revoked_at" },
    },
    { sequelize, tableName: "api_tokens", underscored: true, updatedAt: false },
  );
}
