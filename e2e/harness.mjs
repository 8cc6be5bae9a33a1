// Starts a throwaway Wavesieve (fresh migrated + seeded SQLite file, fake SMTP, `next start`) for e2e tests.
import { spawn, execFileSync } from "node:child_process";
import { mkdtempSync, existsSync, mkdirSync } from "node:fs";
import net from "node:net";
import os from "node:os";
import path from "node:path";

export const ROOT = path.resolve(path.dirname(new URL(import.meta.url).pathname), "..");
export const SCREENSHOTS = path.join(ROOT, "e2e", "screenshots");
export const DEMO_PASSWORD = "wavesieve-demo";
export const ACCOUNTS = {
  admin: "admin@wavesieve.test",
  curator: "curator@wavesieve.test",
  researcher: "researcher@wavesieve.test",
  viewer: "viewer@wavesieve.test",
};

function freePort() {
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.once("error", reject);
    srv.listen(0, "127.0.0.1", () => {
      const { port } = srv.address();
      srv.close(() => resolve(port));
    });
  });
}

async function waitFor(url, ms) {
  const deadline = Date.now() + ms;
  while (Date.now() < deadline) {
    try {
      const res = await fetch(url);
      if (res.ok) return;
    } catch {}
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`server did not answer ${url} within ${ms} ms`);
}

export async function startApp() {
  if (!existsSync(path.join(ROOT, ".next", "BUILD_ID"))) {
    console.log("[e2e] no build found: running next build");
    execFileSync(path.join(ROOT, "node_modules/.bin/next"), ["build"], { cwd: ROOT, stdio: "inherit", env: { ...process.env, NEXT_TELEMETRY_DISABLED: "1" } });
  }
  const dir = mkdtempSync(path.join(os.tmpdir(), "wavesieve-e2e-"));
  const [webPort, smtpPort] = [await freePort(), await freePort()];
  const env = {
    ...process.env,
    NODE_ENV: "production",
    NEXT_TELEMETRY_DISABLED: "1",
    DATABASE_PATH: path.join(dir, "e2e.sqlite"),
    DATABASE_URL: "",
    NEXTAUTH_SECRET: "e2e-secret-0123456789abcdef0123456789",
    NEXTAUTH_URL: `http://localhost:${webPort}`,
    FAKE_SMTP_PORT: String(smtpPort),
    SMTP_URL: `smtp://127.0.0.1:${smtpPort}`,
    E2E: "1",
    DEMO_SCENARIO: "0",
    // The screening worker: a short poll, and (test-only, honoured because E2E=1) a pause before each
    // variant so a browser can watch the progress bar move.
    SCREEN_POLL_MS: "200",
    WAVESIEVE_TEST_STAGE_DELAY_MS: process.env.WAVESIEVE_TEST_STAGE_DELAY_MS ?? "700",
  };
  const cli = path.join(ROOT, "node_modules/sequelize-cli/lib/sequelize");
  execFileSync(process.execPath, [cli, "db:migrate"], { cwd: ROOT, env, stdio: "pipe" });
  execFileSync(process.execPath, [cli, "db:seed:all"], { cwd: ROOT, env, stdio: "pipe" });

  const children = [];
  const logs = [];
  const run = (cmd, args) => {
    const child = spawn(cmd, args, { cwd: ROOT, env, stdio: ["ignore", "pipe", "pipe"] });
    child.stdout.on("data", (d) => logs.push(String(d)));
    child.stderr.on("data", (d) => logs.push(String(d)));
    children.push(child);
    return child;
  };
  run(path.join(ROOT, "node_modules/.bin/tsx"), ["scripts/fake-smtp.ts"]);
  // The same worker as `npm run worker`, started as plain node so stop() reaches the real process.
  run(process.execPath, ["--import", "tsx", "jobs/worker.ts"]);
  run(path.join(ROOT, "node_modules/.bin/next"), ["start", "-p", String(webPort), "-H", "127.0.0.1"]);
  const baseUrl = `http://localhost:${webPort}`;
  try {
    await waitFor(`${baseUrl}/api/health`, 60_000);
  } catch (err) {
    console.error(logs.join(""));
    throw err;
  }
  return {
    baseUrl,
    env,
    logs,
    async stop() {
      for (const c of children) c.kill("SIGTERM");
      await new Promise((r) => setTimeout(r, 300));
    },
  };
}

export async function launchBrowser() {
  const { chromium } = await import("playwright-core");
  mkdirSync(SCREENSHOTS, { recursive: true });
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH || "/usr/bin/chromium",
    headless: true,
    args: ["--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync"],
  });
}

export async function signIn(page, baseUrl, role) {
  await page.goto(`${baseUrl}/signin`);
  await page.getByLabel("E-mail").fill(ACCOUNTS[role]);
  await page.getByLabel("Password").fill(DEMO_PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL(`${baseUrl}/overview`);
}

export const VIEWPORTS = { desktop: { width: 1280, height: 800 }, phone: { width: 390, height: 844 } };

export async function screenshot(page, name) {
  await page.screenshot({ path: path.join(SCREENSHOTS, `${name}.png`), fullPage: false });
}

export function assert(condition, message) {
  if (!condition) throw new Error(message);
}
