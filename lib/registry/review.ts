/**
 * The curators' review queue: entries whose two verdicts conflict (first), then screened
 * candidates awaiting a decision. Curators see every entry, so no visibility filter applies here;
 * callers have checked the curator role.
 */
import { Op } from "sequelize";
import { RegistryEntry } from "@/models";
import { registryRow, type RegistryRow } from "./queries";

export const REVIEW_LIST_LIMIT = 50;

export interface ReviewQueue {
  conflicts: { rows: RegistryRow[]; total: number };
  candidates: { rows: RegistryRow[]; total: number };
  unscreened: number;
}

export async function reviewQueue(limit = REVIEW_LIST_LIMIT): Promise<ReviewQueue> {
  const conflictWhere = { agreement: "conflict", curationState: { [Op.in]: ["candidate", "returned"] } };
  const candidateWhere = { curationState: "candidate", agreement: { [Op.ne]: "conflict" }, variantsScreened: { [Op.gt]: 0 } };
  const [conflictRows, conflictTotal, candidateRows, candidateTotal, unscreened] = [
    await RegistryEntry.findAll({ where: conflictWhere, order: [["screenedAt", "DESC"], ["id", "ASC"]], limit }),
    await RegistryEntry.count({ where: conflictWhere }),
    await RegistryEntry.findAll({ where: candidateWhere, order: [["screenedAt", "ASC"], ["id", "ASC"]], limit }),
    await RegistryEntry.count({ where: candidateWhere }),
    await RegistryEntry.count({ where: { curationState: "candidate", variantsScreened: 0 } }),
  ];
  return {
    conflicts: { rows: conflictRows.map(registryRow), total: conflictTotal },
    candidates: { rows: candidateRows.map(registryRow), total: candidateTotal },
    unscreened,
  };
}
