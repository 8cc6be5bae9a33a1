/**
 * Curation of registry entries: accept, reject or send back with a note; tags; duplicates;
 * publishing. Each action is one transaction and one audit row (target_type "entry") saying who,
 * when (the row's time) and why (the note). Callers have checked the curator role (withRole).
 */
import { Op, type Transaction, type WhereOptions } from "sequelize";
import { Family, RegistryEntry } from "@/models";
import { writeTransaction } from "./db";
import { recordAudit, type Actor } from "@/lib/audit";
import { isUuid, normaliseTag, tagsFromText, tagsToText } from "./filters";
import { syncEntryTags } from "./tags";

export const MAX_NOTE_LENGTH = 2000;
export const MAX_ENTRY_TAGS = 32;

export type CurationAction = "accept" | "reject" | "return";
export const CURATION_ACTIONS: readonly CurationAction[] = ["accept", "reject", "return"];

const NEXT_STATE = { accept: "accepted", reject: "rejected", return: "returned" } as const;

export type CurationResult = { ok: true; entry: RegistryEntry } | { ok: false; status: 400 | 404 | 409; error: string };

function fail(status: 400 | 404 | 409, error: string): CurationResult {
  return { ok: false, status, error };
}

export function cleanNote(note: unknown): string | null {
  if (note === undefined || note === null) return "";
  if (typeof note !== "string") return null;
  const t = note.trim();
  return t.length > MAX_NOTE_LENGTH ? null : t;
}

async function lockedEntry(id: string, transaction: Transaction) {
  if (!isUuid(id)) return null;
  return RegistryEntry.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
}

/** Audit rows are written after the commit, so a rolled-back action leaves no history line. */
async function audit(actor: Actor, action: string, entryId: string, detail: string) {
  await recordAudit(actor, action, "entry", entryId, detail);
}

/**
 * accept / reject / return. Reject and return need a note (the submitter must learn why);
 * accepting an entry whose two verdicts conflict needs one too (how the conflict was resolved).
 * An entry nobody has screened cannot be accepted. Rejecting or returning a published entry
 * unpublishes it.
 */
export async function curateEntry(actor: Actor, id: string, action: CurationAction, rawNote: unknown): Promise<CurationResult> {
  const note = cleanNote(rawNote);
  if (note === null) return fail(400, `the note must be text of at most ${MAX_NOTE_LENGTH} characters`);
  if (action !== "accept" && !note) return fail(400, `a note is required to ${action === "reject" ? "reject" : "send back"} an entry`);
  const outcome = await writeTransaction(async (transaction) => {
    const entry = await lockedEntry(id, transaction);
    if (!entry) return { result: fail(404, "no such entry"), unpublished: false, from: "" };
    const to = NEXT_STATE[action];
    if (entry.curationState === to) return { result: fail(409, `the entry is already ${to}`), unpublished: false, from: entry.curationState };
    if (action === "accept" && entry.variantsScreened === 0) return { result: fail(409, "the entry has not been screened yet; nothing to accept"), unpublished: false, from: entry.curationState };
    if (action === "accept" && entry.agreement === "conflict" && !note) {
      return { result: fail(400, "the two verdicts conflict: say in the note how the conflict was resolved"), unpublished: false, from: entry.curationState };
    }
    const from = entry.curationState;
    const unpublished = action !== "accept" && entry.published;
    await entry.update({ curationState: to, ...(unpublished ? { published: false, publishedAt: null } : {}) }, { transaction });
    return { result: { ok: true, entry } as CurationResult, unpublished, from };
  });
  if (outcome.result.ok) {
    await audit(actor, `entry.${NEXT_STATE[action]}`, id, note ? `${outcome.from} → ${NEXT_STATE[action]}: ${note}` : `${outcome.from} → ${NEXT_STATE[action]}`);
    if (outcome.unpublished) await audit(actor, "entry.unpublished", id, `unpublished because it was ${NEXT_STATE[action]}`);
  }
  return outcome.result;
}

/** Replace the tags (normalised; invalid ones refused). Kept on the family too, so a refresh keeps them. */
export async function setEntryTags(actor: Actor, id: string, rawTags: unknown, rawNote?: unknown): Promise<CurationResult> {
  if (!Array.isArray(rawTags) || rawTags.some((t) => typeof t !== "string")) return fail(400, "tags must be a list of strings");
  const note = cleanNote(rawNote);
  if (note === null) return fail(400, `the note must be text of at most ${MAX_NOTE_LENGTH} characters`);
  const tags: string[] = [];
  for (const raw of rawTags as string[]) {
    const t = normaliseTag(raw);
    if (!t) return fail(400, `tag '${raw.slice(0, 50)}' is not valid: 1–40 characters, no commas`);
    if (!tags.includes(t)) tags.push(t);
  }
  if (tags.length > MAX_ENTRY_TAGS) return fail(400, `at most ${MAX_ENTRY_TAGS} tags`);
  const outcome = await writeTransaction(async (transaction) => {
    const entry = await lockedEntry(id, transaction);
    if (!entry) return { result: fail(404, "no such entry"), before: [] as string[] };
    const before = tagsFromText(entry.tagsText);
    await entry.update({ tagsText: tagsToText(tags) }, { transaction });
    await Family.update({ tagsJson: JSON.stringify(tags) }, { where: { id: entry.familyId }, transaction });
    await syncEntryTags(entry.id, tags, transaction);
    return { result: { ok: true, entry } as CurationResult, before };
  });
  if (outcome.result.ok) {
    const added = tags.filter((t) => !outcome.before.includes(t));
    const removed = outcome.before.filter((t) => !tags.includes(t));
    const change = [added.length ? `added ${added.join(", ")}` : "", removed.length ? `removed ${removed.join(", ")}` : ""].filter(Boolean).join("; ") || "no change";
    await audit(actor, "entry.tags", id, note ? `${change}: ${note}` : change);
  }
  return outcome.result;
}

/**
 * Mark the entry as a duplicate of another (or clear the mark with null). The original may not be
 * the entry itself, nor (through its own marks) lead back to it.
 */
export async function markDuplicate(actor: Actor, id: string, rawOriginal: unknown, rawNote?: unknown): Promise<CurationResult> {
  const note = cleanNote(rawNote);
  if (note === null) return fail(400, `the note must be text of at most ${MAX_NOTE_LENGTH} characters`);
  if (rawOriginal !== null && typeof rawOriginal !== "string") return fail(400, "duplicateOf must be an entry id or null");
  const originalId = rawOriginal as string | null;
  if (originalId !== null && !isUuid(originalId)) return fail(404, "no entry with that id to be a duplicate of");
  if (originalId === id) return fail(400, "an entry cannot be a duplicate of itself");
  const outcome = await writeTransaction(async (transaction) => {
    const entry = await lockedEntry(id, transaction);
    if (!entry) return { result: fail(404, "no such entry"), original: null as RegistryEntry | null };
    if (originalId === null) {
      if (!entry.duplicateOfId) return { result: fail(409, "the entry is not marked as a duplicate"), original: null };
      await entry.update({ duplicateOfId: null }, { transaction });
      return { result: { ok: true, entry } as CurationResult, original: null };
    }
    const original = await RegistryEntry.findByPk(originalId, { transaction });
    if (!original) return { result: fail(404, "no entry with that id to be a duplicate of"), original: null };
    // Walk the original's own marks: a cycle would leave no original at all.
    let cursor: RegistryEntry | null = original;
    for (let hops = 0; cursor?.duplicateOfId && hops < 50; hops++) {
      if (cursor.duplicateOfId === id) return { result: fail(409, `${original.slug} is itself (through its marks) a duplicate of this entry`), original: null };
      cursor = await RegistryEntry.findByPk(cursor.duplicateOfId, { transaction });
    }
    await entry.update({ duplicateOfId: original.id }, { transaction });
    return { result: { ok: true, entry } as CurationResult, original };
  });
  if (outcome.result.ok) {
    const what = outcome.original ? `duplicate of ${outcome.original.slug} (${outcome.original.id})` : "duplicate mark removed";
    await audit(actor, outcome.original ? "entry.duplicate" : "entry.not-duplicate", id, note ? `${what}: ${note}` : what);
  }
  return outcome.result;
}

/** Publish (only accepted entries) or unpublish. */
export async function setPublished(actor: Actor, id: string, published: unknown, rawNote?: unknown): Promise<CurationResult> {
  if (typeof published !== "boolean") return fail(400, "published must be true or false");
  const note = cleanNote(rawNote);
  if (note === null) return fail(400, `the note must be text of at most ${MAX_NOTE_LENGTH} characters`);
  const result = await writeTransaction(async (transaction) => {
    const entry = await lockedEntry(id, transaction);
    if (!entry) return fail(404, "no such entry");
    if (Boolean(entry.published) === published) return fail(409, published ? "the entry is already published" : "the entry is not published");
    if (published && entry.curationState !== "accepted") return fail(409, `only accepted entries can be published (this one is ${entry.curationState})`);
    await entry.update({ published, publishedAt: published ? new Date() : null }, { transaction });
    return { ok: true, entry } as CurationResult;
  });
  if (result.ok) await audit(actor, published ? "entry.published" : "entry.unpublished", id, note || (published ? "published" : "unpublished"));
  return result;
}

/**
 * Entries that may be the same family: the same normalised family hash (uploaded by another owner)
 * or the same canonical coefficients (a different sweep or window of the same model).
 */
export async function duplicateCandidates(id: string, limit = 20) {
  if (!isUuid(id)) return null;
  const entry = await RegistryEntry.findByPk(id);
  if (!entry) return null;
  const keys: WhereOptions<RegistryEntry>[] = [];
  if (entry.normalisedKey) keys.push({ normalisedKey: entry.normalisedKey });
  if (entry.coefficientsKey) keys.push({ coefficientsKey: entry.coefficientsKey });
  if (!keys.length) return [];
  const rows = await RegistryEntry.findAll({
    where: { id: { [Op.ne]: id }, [Op.or]: keys },
    attributes: ["id", "slug", "title", "submitterEmail", "curationState", "published", "normalisedKey", "coefficientsKey", "createdAt"],
    order: [["createdAt", "ASC"]],
    limit,
  });
  return rows.map((r) => ({
    id: r.id,
    slug: r.slug,
    title: r.title,
    submitter: r.submitterEmail,
    curationState: r.curationState,
    published: Boolean(r.published),
    createdAt: new Date(r.createdAt).toISOString(),
    match: r.normalisedKey && r.normalisedKey === entry.normalisedKey ? ("same family" as const) : ("same coefficients" as const),
  }));
}
