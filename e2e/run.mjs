// The e2e runner: one app, one browser, every spec in e2e/specs; prints and saves the counts.
import { readdirSync, writeFileSync, mkdirSync } from "node:fs";
import path from "node:path";
import { ROOT, startApp, launchBrowser } from "./harness.mjs";

const only = process.argv[2];
const specDir = path.join(ROOT, "e2e", "specs");
const files = readdirSync(specDir).filter((f) => f.endsWith(".mjs")).sort();

let passed = 0;
let failed = 0;
const failures = [];
let app;
let browser;
try {
  app = await startApp();
  browser = await launchBrowser();
  for (const file of files) {
    const { tests } = await import(path.join(specDir, file));
    for (const test of tests) {
      if (only && !test.name.includes(only) && !file.includes(only)) continue;
      const contexts = [];
      const newPage = async (viewport = { width: 1280, height: 800 }) => {
        const ctx = await browser.newContext({ viewport, baseURL: app.baseUrl });
        contexts.push(ctx);
        const page = await ctx.newPage();
        page.setDefaultTimeout(20_000);
        return page;
      };
      const started = Date.now();
      try {
        await test.run({ newPage, baseUrl: app.baseUrl, env: app.env });
        passed++;
        console.log(`  ✓ ${file} › ${test.name} (${Date.now() - started} ms)`);
      } catch (err) {
        failed++;
        failures.push({ test: `${file} › ${test.name}`, error: String(err?.stack ?? err) });
        console.log(`  ✗ ${file} › ${test.name}\n    ${String(err?.message ?? err).split("\n")[0]}`);
      } finally {
        for (const ctx of contexts) await ctx.close();
      }
    }
  }
} catch (err) {
  failed++;
  failures.push({ test: "e2e harness", error: String(err?.stack ?? err) });
  console.log(`  ✗ e2e harness: ${err?.message ?? err}`);
} finally {
  await browser?.close();
  await app?.stop();
}
mkdirSync(path.join(ROOT, "test-results"), { recursive: true });
writeFileSync(path.join(ROOT, "test-results", "e2e.json"), JSON.stringify({ passed, failed, failures }, null, 2));
console.log(`e2e: ${passed} passed, ${failed} failed`);
process.exit(failed ? 1 : 0);
