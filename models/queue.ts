import { DataTypes, Model, type Sequelize } from "sequelize";

/**
 * A run counted in a batch's progress. A batch's own runs are linked with linked=false; a run that
 * existed before (the result of an identical family uploaded earlier) is linked with linked=true.
 */
export class BatchRun extends Model {
  declare batchId: string;
  declare runId: string;
  declare linked: boolean;
  declare createdAt: Date;
}

export function initBatchRun(sequelize: Sequelize) {
  BatchRun.init(
    {
      batchId: { type: DataTypes.UUID, primaryKey: true, field: "batch_id" },
      runId: { type: DataTypes.UUID, primaryKey: true, field: "run_id" },
      linked: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    },
    { sequelize, tableName: "batch_runs", underscored: true, updatedAt: false },
  );
}

export type OutgoingMailState = "queued" | "sent" | "failed";

/** A mail waiting to be sent; retried with back-off while the SMTP server is unreachable. */
export class OutgoingMail extends Model {
  declare id: string;
  declare kind: string;
  declare dedupeKey: string | null;
  declare toAddress: string;
  declare subject: string;
  declare textBody: string;
  declare state: OutgoingMailState;
  declare attempts: number;
  declare maxAttempts: number;
  declare nextAttemptAt: Date;
  declare claimToken: string | null;
  declare claimedUntil: Date | null;
  declare lastError: string | null;
  declare sentAt: Date | null;
  declare createdAt: Date;
  declare updatedAt: Date;
}

export function initOutgoingMail(sequelize: Sequelize) {
  OutgoingMail.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      kind: { type: DataTypes.STRING(20), allowNull: false },
      dedupeKey: { type: DataTypes.STRING(200), allowNull: true, unique: true, field: "dedupe_key" },
      toAddress: { type: DataTypes.STRING(254), allowNull: false, field: "to_address" },
      subject: { type: DataTypes.STRING(300), allowNull: false },
      textBody: { type: DataTypes.TEXT, allowNull: false, field: "text_body" },
      state: { type: DataTypes.STRING(10), allowNull: false, defaultValue: "queued" },
      attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      maxAttempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 10, field: "max_attempts" },
      nextAttemptAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW, field: "next_attempt_at" },
      claimToken: { type: DataTypes.STRING(64), allowNull: true, field: "claim_token" },
      claimedUntil: { type: DataTypes.DATE, allowNull: true, field: "claimed_until" },
      lastError: { type: DataTypes.TEXT, allowNull: true, field: "last_error" },
      sentAt: { type: DataTypes.DATE, allowNull: true, field: "sent_at" },
    },
    { sequelize, tableName: "outgoing_mail", underscored: true },
  );
}

/** When a periodic job last did its work (e.g. the digest's "since"). */
export class JobMark extends Model {
  declare name: string;
  declare at: Date;
  declare updatedAt: Date;
}

export function initJobMark(sequelize: Sequelize) {
  JobMark.init(
    {
      name: { type: DataTypes.STRING(60), primaryKey: true },
      at: { type: DataTypes.DATE, allowNull: false },
    },
    { sequelize, tableName: "job_marks", underscored: true, createdAt: false },
  );
}
