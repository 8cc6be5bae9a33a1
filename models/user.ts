import { DataTypes, Model, type Sequelize } from "sequelize";
import type { Role } from "@/lib/auth/roles";

export class User extends Model {
  declare id: string;
  declare email: string;
  declare name: string;
  declare passwordHash: string | null;
  declare role: Role;
  declare disabled: boolean;
  declare failedSignIns: number;
  declare lockedUntil: Date | null;
  declare notifyBatchDone: boolean;
  declare notifyDigest: boolean;
  declare createdAt: Date;
  declare updatedAt: Date;
}

export function initUser(sequelize: Sequelize) {
  User.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
      name: { type: DataTypes.STRING(120), allowNull: false },
      passwordHash: { type: DataTypes.STRING(100), allowNull: true, field: "password_hash" },
      role: { type: DataTypes.STRING(20), allowNull: false, defaultValue: "viewer" },
      disabled: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      failedSignIns: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0, field: "failed_sign_ins" },
      lockedUntil: { type: DataTypes.DATE, allowNull: true, field: "locked_until" },
      notifyBatchDone: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true, field: "notify_batch_done" },
      notifyDigest: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true, field: "notify_digest" },
    },
    { sequelize, tableName: "users", underscored: true },
  );
}
