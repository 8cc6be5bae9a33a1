import { DataTypes, Model, type Sequelize } from "sequelize";

export type CurationState = "candidate" | "accepted" | "rejected" | "returned";

/** The registry's row for one family: summary verdicts of its variants plus curation state. */
export class RegistryEntry extends Model {
  declare id: string;
  declare familyId: string;
  declare slug: string;
  declare title: string;
  declare equationClass: "nls" | "kdv" | "mkdv";
  /** reducible | not-reducible | undecided | mixed | pending */
  declare reducibility: string;
  /** passes | fails | undecided | mixed | not-run | pending */
  declare painleve: string;
  /** agree | conflict | inconclusive | pending */
  declare agreement: string;
  declare variantsTotal: number;
  declare variantsScreened: number;
  declare variantsReducible: number;
  declare curationState: CurationState;
  declare published: boolean;
  declare publishedAt: Date | null;
  declare duplicateOfId: string | null;
  /** Tags as ",tag1,tag2," so one LIKE finds a whole tag. */
  declare tagsText: string;
  declare submitterId: string;
  declare submitterEmail: string;
  declare batchId: string;
  declare engineVersion: string | null;
  declare normalisedKey: string | null;
  /** sha256 of the canonical coefficient texts (class + name=text), for duplicate suggestions across owners. */
  declare coefficientsKey: string | null;
  declare searchText: string;
  declare screenedAt: Date | null;
  declare createdAt: Date;
  declare updatedAt: Date;
}

export function initRegistryEntry(sequelize: Sequelize) {
  RegistryEntry.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      familyId: { type: DataTypes.UUID, allowNull: false, unique: true, field: "family_id" },
      slug: { type: DataTypes.STRING(64), allowNull: false },
      title: { type: DataTypes.STRING(300), allowNull: false },
      equationClass: { type: DataTypes.STRING(8), allowNull: false, field: "equation_class" },
      reducibility: { type: DataTypes.STRING(16), allowNull: false, defaultValue: "pending" },
      painleve: { type: DataTypes.STRING(16), allowNull: false, defaultValue: "pending" },
      agreement: { type: DataTypes.STRING(16), allowNull: false, defaultValue: "pending" },
      variantsTotal: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0, field: "variants_total" },
      variantsScreened: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0, field: "variants_screened" },
      variantsReducible: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0, field: "variants_reducible" },
      curationState: { type: DataTypes.STRING(16), allowNull: false, defaultValue: "candidate", field: "curation_state" },
      published: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      publishedAt: { type: DataTypes.DATE, allowNull: true, field: "published_at" },
      duplicateOfId: { type: DataTypes.UUID, allowNull: true, field: "duplicate_of_id" },
      tagsText: { type: DataTypes.TEXT, allowNull: false, defaultValue: "", field: "tags_text" },
      submitterId: { type: DataTypes.UUID, allowNull: false, field: "submitter_id" },
      submitterEmail: { type: DataTypes.STRING(254), allowNull: false, field: "submitter_email" },
      batchId: { type: DataTypes.UUID, allowNull: false, field: "batch_id" },
      engineVersion: { type: DataTypes.STRING(20), allowNull: true, field: "engine_version" },
      normalisedKey: { type: DataTypes.STRING(64), allowNull: true, field: "normalised_key" },
      coefficientsKey: { type: DataTypes.STRING(64), allowNull: true, field: "coefficients_key" },
      searchText: { type: DataTypes.TEXT, allowNull: false, defaultValue: "", field: "search_text" },
      screenedAt: { type: DataTypes.DATE, allowNull: true, field: "screened_at" },
    },
    { sequelize, tableName: "registry_entries", underscored: true },
  );
}

export class VerdictChange extends Model {
  declare id: string;
  declare entryId: string;
  declare variantId: string;
  declare oldEngine: string | null;
  declare newEngine: string;
  declare oldVerdicts: string;
  declare newVerdicts: string;
  declare createdAt: Date;
}

export function initVerdictChange(sequelize: Sequelize) {
  VerdictChange.init(
    {
      id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
      entryId: { type: DataTypes.UUID, allowNull: false, field: "entry_id" },
      variantId: { type: DataTypes.UUID, allowNull: false, field: "variant_id" },
      oldEngine: { type: DataTypes.STRING(20), allowNull: true, field: "old_engine" },
      newEngine: { type: DataTypes.STRING(20), allowNull: false, field: "new_engine" },
      oldVerdicts: { type: DataTypes.TEXT, allowNull: false, field: "old_verdicts" },
      newVerdicts: { type: DataTypes.TEXT, allowNull: false, field: "new_verdicts" },
    },
    { sequelize, tableName: "verdict_changes", underscored: true, updatedAt: false },
  );
}
