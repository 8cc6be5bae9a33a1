// Integration: the bree scheduler (`npm run jobs`) runs the screening loop in a child process, not
// in a worker thread that has sqlite3 loaded — terminating such a thread with a statement in flight
// aborts the whole process (node-sqlite3 issue #1666, "Terminating a worker thread using sqlite3
// crashes the process", 2022; reproduced with sqlite3 6.0.1 on this machine). Here the scheduler is
// stopped while a run is mid-screen: it must exit cleanly and the run goes back to the queue; and
// when the scheduler is killed outright, its worker process must not live on as an orphan.
import { describe, it, expect, beforeAll } from "vitest";
import { spawn, type ChildProcess } from "node:child_process";
import path from "node:path";
import { createMigratedDatabase, databaseEnv } from "../helpers/db";
import { usersByRole, kdvSweep, storeYaml, waitFor } from "../queue/helpers";
import type { CurrentUser } from "@/lib/auth/current-user";

const dbFile = createMigratedDatabase({ seed: true });

let researcher: CurrentUser;
beforeAll(async () => {
  researcher = (await usersByRole()).researcher;
});

interface Scheduler { child: ChildProcess; output: () => string; exited: Promise<{ code: number | null; signal: string | null }> }

function startScheduler(): Scheduler {
  const child = spawn(process.execPath, ["--import", "tsx", path.resolve("jobs/scheduler.ts")], {
    env: {
      ...process.env, NODE_ENV: "test", ...databaseEnv(dbFile), SMTP_URL: "json",
      WORKER_THREADS: "1", SCREEN_POLL_MS: "100", WAVESIEVE_TEST_STAGE_DELAY_MS: "1500",
    },
    stdio: ["ignore", "pipe", "pipe"],
  });
  let out = "";
  child.stdout?.on("data", (d) => (out += String(d)));
  child.stderr?.on("data", (d) => (out += String(d)));
  const exited = new Promise<{ code: number | null; signal: string | null }>((resolve) => child.on("exit", (code, signal) => resolve({ code, signal })));
  return { child, output: () => out, exited };
}

/** The pid inside the worker's id "host:pid:uuid", printed in its start line. */
async function workerPid(s: Scheduler): Promise<number> {
  const match = await waitFor(async () => /\[worker [^:\]]+:(\d+):[0-9a-f]{8}\] started/.exec(s.output()), 60_000, "the worker's start line");
  return Number(match[1]);
}

function alive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}

describe("the scheduler's screening loop runs in its own process", () => {
  it("SIGTERM mid-run: the scheduler exits 0, the worker process ends, the run is handed back to the queue", async () => {
    const stored = await storeYaml(researcher, "relay.yaml", kdvSweep("relay-batch", 2));
    const { ScreeningRun } = await import("@/models");
    const scheduler = startScheduler();
    const pid = await workerPid(scheduler);
    expect(pid).not.toBe(scheduler.child.pid); // a process of its own
    await waitFor(async () => (await ScreeningRun.count({ where: { batchId: stored.id, state: "running" } })) >= 1, 60_000, "a run in progress", 25);

    scheduler.child.kill("SIGTERM");
    expect(await scheduler.exited).toEqual({ code: 0, signal: null });
    await waitFor(async () => !alive(pid), 20_000, "the worker process to end");
    expect(scheduler.output()).toContain("SIGTERM: stopping");
    const runs = await ScreeningRun.findAll({ where: { batchId: stored.id } });
    expect(runs.some((r) => r.state === "running")).toBe(false); // none left claimed by a dead process
    expect(runs.filter((r) => r.state === "queued").length).toBeGreaterThanOrEqual(1);
  }, 120_000);

  it("SIGKILL of the scheduler: its worker process notices the closed pipe and stops by itself", async () => {
    const scheduler = startScheduler();
    const pid = await workerPid(scheduler);
    expect(alive(pid)).toBe(true);
    scheduler.child.kill("SIGKILL");
    expect((await scheduler.exited).signal).toBe("SIGKILL");
    await waitFor(async () => !alive(pid), 20_000, "the orphaned worker process to stop");
  }, 120_000);
});
