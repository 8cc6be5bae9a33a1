/**
 * `npm run jobs`: the bree scheduler. Runs the screening worker loop ("screen", restarted
 * whenever it ends), the nightly re-screen (RESCREEN_CRON, default "0 2 * * *", server time) and
 * the curators' digest (DIGEST_CRON, default "0 7 * * *"). Each job is a worker thread running
 * the TypeScript sources through tsx (TOOLCHAIN pitfalls 6 and 8) that relays to a child process
 * doing the work (jobs/child-process.ts says why).
 */
import path from "node:path";
import Bree from "bree";

const RESCREEN_CRON = process.env.RESCREEN_CRON || "0 2 * * *";
const DIGEST_CRON = process.env.DIGEST_CRON || "0 7 * * *";
const RESTART_MS = 2_000;

function main(): void {
  const root = path.resolve(__dirname);
  const logger = {
    info: (message: unknown) => console.log(`[jobs] ${String(message)}`),
    warn: (message: unknown) => console.warn(`[jobs] ${String(message)}`),
    error: (message: unknown, meta?: { err?: unknown }) => console.error(`[jobs] ${String(message)}`, meta?.err ?? ""),
  };
  const bree = new Bree({
    root,
    logger,
    defaultExtension: "ts",
    acceptedExtensions: [".ts", ".mjs", ".js"],
    worker: { execArgv: ["--conditions=react-server", "--require", "tsx/cjs"] },
    jobs: [
      { name: "screen", path: path.join(root, "screen.ts") },
      { name: "rescreen", path: path.join(root, "rescreen.ts"), cron: RESCREEN_CRON },
      { name: "digest", path: path.join(root, "digest.ts"), cron: DIGEST_CRON },
    ],
  });
  let stopping = false;
  bree.on("worker deleted", (name: string) => {
    if (name === "screen" && !stopping) setTimeout(() => { if (!stopping) void bree.run("screen"); }, RESTART_MS);
  });
  const stop = (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`[jobs] ${signal}: stopping`);
    void bree.stop().then(() => process.exit(0));
  };
  process.on("SIGINT", () => stop("SIGINT"));
  process.on("SIGTERM", () => stop("SIGTERM"));
  bree.start().then(
    () => console.log(`[jobs] scheduler started: screen (always on), rescreen "${RESCREEN_CRON}", digest "${DIGEST_CRON}"`),
    (err) => {
      console.error("[jobs] could not start:", err);
      process.exit(1);
    },
  );
}

main();
