/**
 * Entry of an engine thread (node:worker_threads), started by lib/queue/thread-pool.ts. It screens
 * one variant per message and reports each stage as it starts, so the parent knows where a run
 * was when it had to stop it. The parent enforces the time and memory limits by terminating this
 * thread; nothing here needs to be cooperative.
 *
 * Test-only switches (honoured only when NODE_ENV=test or E2E=1):
 *   WAVESIEVE_TEST_STAGE_DELAY_MS=n   wait n ms before screening (makes batches slow enough to watch or kill)
 *   WAVESIEVE_TEST_SLOW_STAGE=s       spin forever when the engine enters stage s (a hang)
 *   WAVESIEVE_TEST_EXIT_STAGE=s       exit the thread when the engine enters stage s (a crash)
 *   WAVESIEVE_TEST_ALLOC_STAGE=s      allocate memory without bound in stage s (runs out of memory)
 * where s is a stage name ("prepare", "reducibility", "painleve", "done"), optionally "@i" to
 * affect only the variant with index i.
 */
import { parentPort } from "node:worker_threads";
import { screenVariant, type Variant } from "@/lib/screening";
import { createSymbolicWorker, type SymbolicWorker } from "@/lib/symbolic-worker";
import { testHooksEnabled } from "./config";
import type { FromThread, ToThread } from "./thread-protocol";

const CLASSES = new Set(["nls", "kdv", "mkdv"]);

/** The stored variant must have the shape the engine expects; anything else is the input's fault. */
export function checkVariant(value: unknown): { ok: true; variant: Variant } | { ok: false; message: string } {
  if (!value || typeof value !== "object") return { ok: false, message: "the stored variant is not an object" };
  const v = value as Partial<Variant>;
  if (typeof v.familyId !== "string" || typeof v.index !== "number") return { ok: false, message: "the stored variant has no family id or index" };
  if (typeof v.class !== "string" || !CLASSES.has(v.class)) return { ok: false, message: `unknown equation class ${JSON.stringify(v.class)}` };
  if (!v.coefficients || typeof v.coefficients !== "object") return { ok: false, message: "the stored variant has no coefficients" };
  const w = v.window;
  if (!Array.isArray(w) || w.length !== 2 || !w.every((x) => typeof x === "number" && Number.isFinite(x)) || !(w[0] < w[1]))
    return { ok: false, message: "the window must be two finite numbers [t0, t1] with t0 < t1" };
  if (!Array.isArray(v.free) || !v.parameters || typeof v.parameters !== "object") return { ok: false, message: "the stored variant has no parameter lists" };
  return { ok: true, variant: v as Variant };
}

/** "stage" or "stage@index": the stage, and optionally only the variant with that index. */
function selector(raw: string | undefined): { stage: string; index: number | null } | null {
  if (!raw) return null;
  const [stage, index] = raw.split("@");
  return { stage, index: index === undefined ? null : Number(index) };
}

const on = testHooksEnabled();
const hooks = {
  delayMs: on ? Number(process.env.WAVESIEVE_TEST_STAGE_DELAY_MS || 0) : 0,
  slow: on ? selector(process.env.WAVESIEVE_TEST_SLOW_STAGE) : null,
  exit: on ? selector(process.env.WAVESIEVE_TEST_EXIT_STAGE) : null,
  alloc: on ? selector(process.env.WAVESIEVE_TEST_ALLOC_STAGE) : null,
};

const hit = (s: { stage: string; index: number | null } | null, stage: string, index: number) => s !== null && s.stage === stage && (s.index === null || s.index === index);

function testHook(stage: string, index: number): void {
  if (hit(hooks.slow, stage, index)) for (;;) Math.sqrt(Math.random()); // never returns: the parent's timer must stop it
  if (hit(hooks.exit, stage, index)) process.exit(3);
  if (hit(hooks.alloc, stage, index)) {
    const hoard: number[][] = [];
    for (;;) hoard.push(new Array(1 << 20).fill(Math.random()));
  }
}

let symbolic: SymbolicWorker | null = null;

async function screen(id: number, variantJson: string): Promise<FromThread> {
  let stage = "prepare";
  const post = (message: FromThread) => parentPort?.postMessage(message);
  post({ type: "stage", id, stage });
  let parsed: unknown;
  try {
    parsed = JSON.parse(variantJson);
  } catch {
    return { type: "input-error", id, message: "the stored variant is not valid JSON", stage };
  }
  const checked = checkVariant(parsed);
  if (!checked.ok) return { type: "input-error", id, message: checked.message, stage };
  if (hooks.delayMs > 0) await new Promise((r) => setTimeout(r, hooks.delayMs));
  testHook(stage, checked.variant.index);
  try {
    symbolic ??= createSymbolicWorker();
    const report = await screenVariant(checked.variant, {
      symbolic: symbolic.hook,
      onStage: (s) => {
        stage = s;
        post({ type: "stage", id, stage: s });
        testHook(s, checked.variant.index);
      },
    });
    return { type: "done", id, reportJson: JSON.stringify(report), engine: report.engine, stage };
  } catch (err) {
    return { type: "engine-error", id, message: err instanceof Error ? err.message : String(err), stage };
  }
}

if (parentPort) {
  const port = parentPort;
  port.on("message", (msg: ToThread) => {
    if (msg.type !== "screen") return;
    void screen(msg.id, msg.variantJson).then((reply) => port.postMessage(reply));
  });
  port.postMessage({ type: "ready" } satisfies FromThread);
}
