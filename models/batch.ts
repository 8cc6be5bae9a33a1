import { DataTypes, Model, type Sequelize } from "sequelize";

export type BatchState = "queued" | "running" | "done" | "cancelled";

/** One upload: the files a researcher submitted together. */
export class Batch extends Model {
  declare id: string;
  declare ownerId: string;
  declare title: string;
  declare state: BatchState;
  declare filesJson: string;
  declare familyCount: number;
  declare variantCount: number;
  declare errorCount: number;
  /** When the first run was claimed, the last one finished, the owner asked to cancel. */
  declare startedAt: Date | null;
  declare finishedAt: Date | null;
  declare cancelRequestedAt: Date | null;
  declare createdAt: Date;
  declare updatedAt: Date;
}

export function initBatch(sequelize: Sequelize) {
  Batch.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      ownerId: { type: DataTypes.UUID, allowNull: false, field: "owner_id" },
      title: { type: DataTypes.STRING(200), allowNull: false },
      state: { type: DataTypes.STRING(20), allowNull: false, defaultValue: "queued" },
      filesJson: { type: DataTypes.TEXT, allowNull: false, defaultValue: "[]", field: "files_json" },
      familyCount: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0, field: "family_count" },
      variantCount: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0, field: "variant_count" },
      errorCount: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0, field: "error_count" },
      startedAt: { type: DataTypes.DATE, allowNull: true, field: "started_at" },
      finishedAt: { type: DataTypes.DATE, allowNull: true, field: "finished_at" },
      cancelRequestedAt: { type: DataTypes.DATE, allowNull: true, field: "cancel_requested_at" },
    },
    { sequelize, tableName: "batches", underscored: true },
  );
}
