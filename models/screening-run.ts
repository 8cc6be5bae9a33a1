import { DataTypes, Model, type Sequelize } from "sequelize";
import { verdictColumns } from "@/lib/registry/verdicts";

export type RunState = "queued" | "running" | "done" | "failed" | "cancelled" | "timed-out";
export type RunPurpose = "upload" | "rescreen" | "design";

/** One screening of one variant; the queue row and, when done, the stored report. */
export class ScreeningRun extends Model {
  declare id: string;
  declare variantId: string;
  declare familyId: string;
  declare batchId: string | null;
  declare purpose: RunPurpose;
  declare state: RunState;
  declare stage: string | null;
  declare attempts: number;
  declare maxAttempts: number;
  declare availableAt: Date;
  declare claimToken: string | null;
  declare leaseExpiresAt: Date | null;
  declare engineVersion: string | null;
  declare reportJson: string | null;
  /** Derived from reportJson by the hooks below (never set by hand). */
  declare reducibilityVerdict: string | null;
  declare painleveVerdict: string | null;
  declare agreementVerdict: string | null;
  declare error: string | null;
  declare startedAt: Date | null;
  declare finishedAt: Date | null;
  /** Set by a batch cancel while the run is going; the worker stops it when it next reports. */
  declare cancelRequested: boolean;
  /** Which worker process holds the claim (for the queue panel and logs). */
  declare claimedBy: string | null;
  declare createdAt: Date;
  declare updatedAt: Date;
}

export function initScreeningRun(sequelize: Sequelize) {
  ScreeningRun.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      variantId: { type: DataTypes.UUID, allowNull: false, field: "variant_id" },
      familyId: { type: DataTypes.UUID, allowNull: false, field: "family_id" },
      batchId: { type: DataTypes.UUID, allowNull: true, field: "batch_id" },
      purpose: { type: DataTypes.STRING(12), allowNull: false, defaultValue: "upload" },
      state: { type: DataTypes.STRING(12), allowNull: false, defaultValue: "queued" },
      stage: { type: DataTypes.STRING(40), allowNull: true },
      attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      maxAttempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 3, field: "max_attempts" },
      availableAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW, field: "available_at" },
      claimToken: { type: DataTypes.STRING(64), allowNull: true, field: "claim_token" },
      leaseExpiresAt: { type: DataTypes.DATE, allowNull: true, field: "lease_expires_at" },
      engineVersion: { type: DataTypes.STRING(20), allowNull: true, field: "engine_version" },
      reportJson: { type: DataTypes.TEXT, allowNull: true, field: "report_json" },
      reducibilityVerdict: { type: DataTypes.STRING(20), allowNull: true, field: "reducibility_verdict" },
      painleveVerdict: { type: DataTypes.STRING(20), allowNull: true, field: "painleve_verdict" },
      agreementVerdict: { type: DataTypes.STRING(20), allowNull: true, field: "agreement_verdict" },
      error: { type: DataTypes.TEXT, allowNull: true },
      startedAt: { type: DataTypes.DATE, allowNull: true, field: "started_at" },
      finishedAt: { type: DataTypes.DATE, allowNull: true, field: "finished_at" },
      cancelRequested: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false, field: "cancel_requested" },
      claimedBy: { type: DataTypes.STRING(80), allowNull: true, field: "claimed_by" },
    },
    {
      sequelize,
      tableName: "screening_runs",
      underscored: true,
      // Every way a report is written (create, save/update, bulk create, static update) keeps the
      // verdict columns in step with it.
      hooks: {
        beforeSave(run) {
          if (run.changed("reportJson")) run.set(verdictColumns(run.reportJson));
        },
        beforeBulkCreate(runs) {
          for (const run of runs) run.set(verdictColumns(run.reportJson ?? null));
        },
        beforeBulkUpdate(options) {
          const o = options as unknown as { attributes: Record<string, unknown>; fields?: string[] };
          if (!("reportJson" in o.attributes)) return;
          const columns = verdictColumns((o.attributes.reportJson as string | null) ?? null);
          Object.assign(o.attributes, columns);
          if (o.fields) o.fields.push(...Object.keys(columns));
        },
      },
    },
  );
}
