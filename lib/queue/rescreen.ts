/**
 * The nightly re-screen: every registry entry whose reports came (in part) from an engine older
 * than ENGINE_VERSION gets a run (purpose "rescreen") for each variant whose latest done report is
 * older, unless that variant already has a run queued or running. When such a run is done the
 * verdicts are compared with the previous report (lib/queue/changes.ts).
 */
import { Op } from "sequelize";
import { RegistryEntry, ScreeningRun, FamilyVariant } from "@/models";
import { latestReports } from "@/lib/registry/refresh";
import { ENGINE_VERSION } from "@/lib/screening/version";
import { writeTransaction } from "./db";
import { enqueueRun } from "./enqueue";

/** Numeric comparison of dotted versions ("0.10.0" > "0.9.3"); non-numeric parts compare as text. */
export function compareVersions(a: string, b: string): number {
  const pa = a.split(/[.-]/);
  const pb = b.split(/[.-]/);
  for (let i = 0; i < Math.max(pa.length, pb.length); i++) {
    const x = pa[i] ?? "0";
    const y = pb[i] ?? "0";
    const nx = Number(x);
    const ny = Number(y);
    const c = Number.isFinite(nx) && Number.isFinite(ny) ? nx - ny : x.localeCompare(y);
    if (c !== 0) return Math.sign(c);
  }
  return 0;
}

export function isOlderEngine(version: string | null | undefined, current = ENGINE_VERSION): boolean {
  return Boolean(version) && compareVersions(version as string, current) < 0;
}

export interface RescreenResult {
  entries: number;
  queued: number;
}

export async function enqueueRescreens(now = new Date(), engine = ENGINE_VERSION): Promise<RescreenResult> {
  const entries = await RegistryEntry.findAll({ where: { engineVersion: { [Op.ne]: null } }, attributes: ["id", "familyId", "engineVersion"] });
  let queued = 0;
  let touched = 0;
  for (const entry of entries) {
    if (!isOlderEngine(entry.engineVersion, engine)) continue;
    const added = await writeTransaction(async (t) => {
      const latest = await latestReports(entry.familyId, t);
      const stale = [...latest.values()].filter((run) => isOlderEngine(run.engineVersion, engine)).map((run) => run.variantId);
      if (stale.length === 0) return 0;
      const busy = await ScreeningRun.findAll({ where: { variantId: { [Op.in]: stale }, state: { [Op.in]: ["queued", "running"] } }, attributes: ["variantId"], transaction: t });
      const skip = new Set(busy.map((r) => r.variantId));
      const variants = await FamilyVariant.findAll({ where: { id: { [Op.in]: stale.filter((id) => !skip.has(id)) } }, attributes: ["id", "familyId"], transaction: t });
      for (const v of variants) await enqueueRun(t, v, "rescreen", now);
      return variants.length;
    });
    if (added > 0) touched++;
    queued += added;
  }
  return { entries: touched, queued };
}
