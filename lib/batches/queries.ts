import { Op } from "sequelize";
import { Batch, Family, BatchFamily, User } from "@/models";
import { hasRole } from "@/lib/auth/roles";
import type { CurrentUser } from "@/lib/auth/current-user";

/** Researchers see their own batches; curators and admins see everyone's. */
function visibleWhere(user: CurrentUser) {
  return hasRole(user.role, "curator") ? {} : { ownerId: user.id };
}

function batchView(b: Batch, ownerEmail?: string) {
  return {
    id: b.id, title: b.title, state: b.state, owner: ownerEmail ?? null,
    families: b.familyCount, variants: b.variantCount, errors: b.errorCount,
    files: JSON.parse(b.filesJson) as unknown[], createdAt: b.createdAt.toISOString(), updatedAt: b.updatedAt.toISOString(),
  };
}

async function ownerEmails(ids: string[]) {
  const users = await User.findAll({ where: { id: { [Op.in]: [...new Set(ids)] } }, attributes: ["id", "email"] });
  return new Map(users.map((u) => [u.id, u.email]));
}

export async function listBatches(user: CurrentUser, limit = 100) {
  const rows = await Batch.findAll({ where: visibleWhere(user), order: [["createdAt", "DESC"]], limit });
  const emails = await ownerEmails(rows.map((r) => r.ownerId));
  return rows.map((b) => batchView(b, emails.get(b.ownerId)));
}

export async function getBatch(user: CurrentUser, id: string) {
  const batch = await Batch.findOne({ where: { id, ...visibleWhere(user) } });
  if (!batch) return null;
  const links = await BatchFamily.findAll({ where: { batchId: id } });
  const families = await Family.findAll({ where: { id: { [Op.in]: links.map((l) => l.familyId) } }, order: [["createdAt", "ASC"]] });
  const reused = new Map(links.map((l) => [l.familyId, l.reused]));
  const emails = await ownerEmails([batch.ownerId]);
  return {
    ...batchView(batch, emails.get(batch.ownerId)),
    familyList: families.map((f) => ({
      id: f.id, slug: f.slug, title: f.title, class: f.equationClass, variants: f.variantCount,
      file: f.fileName, reused: reused.get(f.id) ?? false, tags: JSON.parse(f.tagsJson) as string[],
    })),
  };
}
