import { DataTypes, Model, type Sequelize } from "sequelize";

/** Who did what, when, to which target. Rows are only ever added. */
export class AuditEvent extends Model {
  declare id: string;
  declare actorId: string | null;
  declare actorEmail: string | null;
  declare action: string;
  declare targetType: string;
  declare targetId: string | null;
  declare detail: string | null;
  declare createdAt: Date;
}

export function initAuditEvent(sequelize: Sequelize) {
  AuditEvent.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      actorId: { type: DataTypes.UUID, allowNull: true, field: "actor_id" },
      actorEmail: { type: DataTypes.STRING(254), allowNull: true, field: "actor_email" },
      action: { type: DataTypes.STRING(60), allowNull: false },
      targetType: { type: DataTypes.STRING(40), allowNull: false, field: "target_type" },
      targetId: { type: DataTypes.STRING(64), allowNull: true, field: "target_id" },
      detail: { type: DataTypes.TEXT, allowNull: true },
    },
    { sequelize, tableName: "audit_events", underscored: true, updatedAt: false },
  );
}
