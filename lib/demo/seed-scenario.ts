/**
 * The demo scenario of a fresh install: the demo researcher submits the files in examples/
 * through the same code path as an upload, the queue screens every variant, and the demo curator
 * reviews part of the result — so the registry is full of real reports, not invented numbers.
 * Idempotent: does nothing once the demo researcher has a batch.
 */
import { readFileSync } from "node:fs";
import path from "node:path";
import { Batch, RegistryEntry, User } from "@/models";
import { validateFiles, storeBatch } from "@/lib/batches";
import { startWorker } from "@/lib/queue/worker";
import { curateEntry, setPublished } from "@/lib/registry/curation";

/** Batches as the invented groups would submit them (title → files in examples/). */
export const DEMO_BATCHES: { title: string; files: string[] }[] = [
  { title: "Tapered amplifier designs, round 1", files: ["fibre-amplifiers.yaml", "dispersion-managed-links.yaml"] },
  { title: "Trap and interaction ramps", files: ["condensate-trap-ramps.yaml", "condensate-interaction-ramps.yaml"] },
  { title: "Harbour channel long waves", files: ["channel-waves-kdv.yaml"] },
  { title: "Ion-acoustic pulses", files: ["plasma-mkdv.yaml"] },
  { title: "Whiteboard equations", files: ["written-as-equations.yaml"] },
  { title: "First drafts (with mistakes)", files: ["drafts-with-errors.yaml"] },
];

/** Batches whose accepted entries the curator leaves unreviewed, so the Review page has work. */
const LEFT_FOR_REVIEW = new Set(["Whiteboard equations", "First drafts (with mistakes)"]);

export async function seedDemoScenario(log: (line: string) => void = console.log): Promise<void> {
  const researcher = await User.findOne({ where: { email: "researcher@wavesieve.test" } });
  const curator = await User.findOne({ where: { email: "curator@wavesieve.test" } });
  if (!researcher || !curator) throw new Error("demo users missing: run the demo-users seeder first");
  if ((await Batch.count({ where: { ownerId: researcher.id } })) > 0) {
    log("[demo] the demo researcher has batches already; nothing to do");
    return;
  }
  const owner = { id: researcher.id, email: researcher.email, name: researcher.name, role: researcher.role };
  const batchIds = new Map<string, string>();
  for (const batch of DEMO_BATCHES) {
    const files = batch.files.map((name) => ({ name, text: readFileSync(path.resolve("examples", name), "utf8") }));
    const stored = await storeBatch(owner, validateFiles(files), batch.title);
    batchIds.set(batch.title, stored.id);
    log(`[demo] submitted "${batch.title}": ${stored.families} families, ${stored.variants} variants, ${stored.errors} file errors`);
  }

  const started = Date.now();
  const worker = startWorker({ stopWhenIdle: true, log: () => {} });
  const stats = await worker.done;
  log(`[demo] screened in ${((Date.now() - started) / 1000).toFixed(0)} s: ${JSON.stringify(stats.finished)}`);

  const actor = { id: curator.id, email: curator.email };
  for (const [title, batchId] of batchIds) {
    if (LEFT_FOR_REVIEW.has(title)) continue;
    const entries = await RegistryEntry.findAll({ where: { batchId } });
    for (const entry of entries) {
      if (entry.agreement === "conflict") continue; // conflicts stay in the Review queue
      if (entry.reducibility === "reducible") {
        await curateEntry(actor, entry.id, "accept", "Both judges agree and the numerical check passed.");
        await setPublished(actor, entry.id, true, "Published for the group.");
      } else if (entry.reducibility === "not-reducible") {
        await curateEntry(actor, entry.id, "reject", "Not reducible by a point map; kept as a control.");
      }
    }
  }
  log("[demo] the curator accepted and published the reducible entries of the first four batches");
}
