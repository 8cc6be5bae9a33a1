/**
 * Worker-thread side of the symbolic hook: runs one algebrite job per message. algebrite keeps
 * global state between calls and can hang (ENGINE-NOTES §2), so every job starts with `clearall`
 * and the parent terminates this worker on timeout. Only engine-printed expressions arrive here.
 */
import { parentPort } from "node:worker_threads";
import Algebrite from "algebrite";

interface Job {
  id: number;
  kind: "simplify" | "solve";
  expression: string;
  unknown?: string;
}

/** Characters the engine's printer produces (identifiers, digits, operators, parentheses, commas). */
const SAFE_EXPRESSION = /^[A-Za-z0-9_+\-*/^()., ]+$/;
const IDENTIFIER = /^[A-Za-z_][A-Za-z0-9_]*$/;

function run(job: Job): string | null {
  if (!SAFE_EXPRESSION.test(job.expression)) return null;
  Algebrite.clearall();
  let command: string;
  if (job.kind === "simplify") command = `simplify(${job.expression})`;
  else {
    if (!job.unknown || !IDENTIFIER.test(job.unknown)) return null;
    command = `roots(numerator(rationalize(${job.expression})),${job.unknown})`;
  }
  const out = Algebrite.run(command);
  if (typeof out !== "string" || out.trim() === "" || /^Stop|nil/.test(out)) return null;
  return out;
}

parentPort?.on("message", (job: Job) => {
  let result: string | null = null;
  let error: string | undefined;
  try {
    result = run(job);
  } catch (err) {
    error = err instanceof Error ? err.message : String(err);
  }
  parentPort?.postMessage({ id: job.id, result, error });
});
