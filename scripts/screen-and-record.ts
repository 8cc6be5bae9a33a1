/**
 * Screen stored variants synchronously (no queue, no worker) and record each report in the registry.
 * For demos, tests and small installs; the queue does the same work in the background.
 *
 *   tsx scripts/screen-and-record.ts [--batch <id>] [--family <id>] [--all] [--limit N] [--seed N]
 *
 * Without --all only variants that have no finished report yet are screened. DATABASE_PATH /
 * DATABASE_URL select the database as for the app. Prints one JSON summary line.
 */
import { Op, literal, type WhereOptions } from "sequelize";
import { BatchFamily, FamilyVariant, sequelize } from "@/models";
import { screenVariant, type Variant } from "@/lib/screening";
import { recordReport } from "@/lib/registry/ingest";

interface Args {
  batch?: string;
  family?: string;
  all: boolean;
  limit: number;
  seed?: number;
}

function parseArgs(argv: string[]): Args {
  const args: Args = { all: false, limit: 10_000 };
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    const next = () => {
      const v = argv[++i];
      if (v === undefined) throw new Error(`${a} needs a value`);
      return v;
    };
    if (a === "--batch") args.batch = next();
    else if (a === "--family") args.family = next();
    else if (a === "--all") args.all = true;
    else if (a === "--limit") args.limit = Number(next());
    else if (a === "--seed") args.seed = Number(next());
    else throw new Error(`unknown argument ${a}`);
  }
  return args;
}

async function main() {
  const args = parseArgs(process.argv.slice(2));
  const where: WhereOptions<FamilyVariant>[] = [];
  if (args.family) where.push({ familyId: args.family });
  if (args.batch) {
    const links = await BatchFamily.findAll({ where: { batchId: args.batch }, attributes: ["familyId"] });
    where.push({ familyId: { [Op.in]: links.map((l) => l.familyId) } });
  }
  if (!args.all) where.push(literal("id NOT IN (SELECT variant_id FROM screening_runs WHERE state = 'done')") as unknown as WhereOptions<FamilyVariant>);
  const variants = await FamilyVariant.findAll({ where: { [Op.and]: where }, order: [["familyId", "ASC"], ["variantIndex", "ASC"]], limit: args.limit });
  const counts: Record<string, number> = {};
  const failures: { variantId: string; error: string }[] = [];
  const started = Date.now();
  for (const row of variants) {
    const variant = JSON.parse(row.variantJson) as Variant;
    const startedAt = new Date();
    try {
      const report = await screenVariant(variant, args.seed === undefined ? {} : { seed: args.seed });
      const stored = await recordReport(row.id, report, { startedAt });
      if (!stored.ok) throw new Error(stored.error);
      const key = `${report.reducibility.verdict}/${report.painleve.verdict}`;
      counts[key] = (counts[key] ?? 0) + 1;
    } catch (err) {
      failures.push({ variantId: row.id, error: err instanceof Error ? err.message : String(err) });
    }
  }
  console.log(JSON.stringify({ screened: variants.length - failures.length, failed: failures.length, verdicts: counts, failures, ms: Date.now() - started }));
  await sequelize.close();
  if (failures.length) process.exitCode = 1;
}

main().catch(async (err) => {
  console.error(err instanceof Error ? err.stack : err);
  await sequelize.close().catch(() => undefined);
  process.exit(1);
});
