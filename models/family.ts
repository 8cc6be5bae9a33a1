import { DataTypes, Model, type Sequelize } from "sequelize";

/** One model family as uploaded; its variants come from the sweep expansion. */
export class Family extends Model {
  declare id: string;
  declare ownerId: string;
  declare firstBatchId: string;
  declare slug: string;
  declare title: string;
  declare equationClass: "nls" | "kdv" | "mkdv";
  declare contentHash: string;
  declare specJson: string;
  declare sourceYaml: string;
  declare fileName: string | null;
  declare documentIndex: number | null;
  declare tagsJson: string;
  declare notes: string;
  declare variantCount: number;
  declare createdAt: Date;
  declare updatedAt: Date;
}

export function initFamily(sequelize: Sequelize) {
  Family.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      ownerId: { type: DataTypes.UUID, allowNull: false, field: "owner_id" },
      firstBatchId: { type: DataTypes.UUID, allowNull: false, field: "first_batch_id" },
      slug: { type: DataTypes.STRING(64), allowNull: false },
      title: { type: DataTypes.STRING(300), allowNull: false },
      equationClass: { type: DataTypes.STRING(8), allowNull: false, field: "equation_class" },
      contentHash: { type: DataTypes.STRING(64), allowNull: false, field: "content_hash" },
      specJson: { type: DataTypes.TEXT, allowNull: false, field: "spec_json" },
      sourceYaml: { type: DataTypes.TEXT, allowNull: false, field: "source_yaml" },
      fileName: { type: DataTypes.STRING(255), allowNull: true, field: "file_name" },
      documentIndex: { type: DataTypes.INTEGER, allowNull: true, field: "document_index" },
      tagsJson: { type: DataTypes.TEXT, allowNull: false, defaultValue: "[]", field: "tags_json" },
      notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
      variantCount: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1, field: "variant_count" },
    },
    { sequelize, tableName: "families", underscored: true },
  );
}

/** Link between a batch and a family it contains (a re-uploaded family is linked, not copied). */
export class BatchFamily extends Model {
  declare batchId: string;
  declare familyId: string;
  declare reused: boolean;
  declare createdAt: Date;
}

export function initBatchFamily(sequelize: Sequelize) {
  BatchFamily.init(
    {
      batchId: { type: DataTypes.UUID, primaryKey: true, field: "batch_id" },
      familyId: { type: DataTypes.UUID, primaryKey: true, field: "family_id" },
      reused: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    },
    { sequelize, tableName: "batch_families", underscored: true, updatedAt: false },
  );
}

export class FamilyVariant extends Model {
  declare id: string;
  declare familyId: string;
  declare variantIndex: number;
  declare parametersJson: string;
  /** The engine-ready Variant (expression trees included), so workers need not re-parse. */
  declare variantJson: string;
  declare createdAt: Date;
}

export function initFamilyVariant(sequelize: Sequelize) {
  FamilyVariant.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      familyId: { type: DataTypes.UUID, allowNull: false, field: "family_id" },
      variantIndex: { type: DataTypes.INTEGER, allowNull: false, field: "variant_index" },
      parametersJson: { type: DataTypes.TEXT, allowNull: false, defaultValue: "{}", field: "parameters_json" },
      variantJson: { type: DataTypes.TEXT, allowNull: false, field: "variant_json" },
    },
    { sequelize, tableName: "variants", underscored: true, updatedAt: false },
  );
}
