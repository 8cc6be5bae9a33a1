// Background screening as a researcher sees it: submit a file, watch the batch page's progress bar
// reach 100 % without reloading, and find the "batch screened" mail in the outbox.
import path from "node:path";
import { ROOT, assert, screenshot, signIn } from "../harness.mjs";

const FIXTURE = path.join(ROOT, "e2e", "fixtures", "tidal-bore-sweep.yaml");

async function outbox(page) {
  return page.evaluate(async () => (await (await fetch("/api/outbox", { cache: "no-store" })).json()).messages ?? []);
}

export const tests = [
  {
    name: "a researcher submits a file, watches the progress bar reach 100 % live, and the finish mail arrives",
    async run({ newPage, baseUrl }) {
      const page = await newPage();
      await signIn(page, baseUrl, "researcher");
      await page.goto(`${baseUrl}/submit`);
      await page.getByTestId("file-input").setInputFiles([FIXTURE]);
      await page.getByTestId("file-report").first().waitFor();
      await page.getByRole("button", { name: /Submit 1 valid famil/ }).click();
      await page.getByText("Batch stored").waitFor();
      await page.getByRole("link", { name: "Open the batch" }).click();
      await page.getByTestId("batch-progress").waitFor();
      const batchUrl = page.url();
      const batchId = batchUrl.split("/").pop();

      // A marker on window survives only if the page is never reloaded.
      await page.evaluate(() => { window.__noReload = "still here"; });
      const seen = [];
      const deadline = Date.now() + 120_000;
      for (;;) {
        const text = (await page.getByTestId("progress-percent").textContent()).trim();
        const percent = Number(text.replace(/[^\d]/g, ""));
        if (seen[seen.length - 1] !== percent) seen.push(percent);
        if (percent === 100) break;
        if (Date.now() > deadline) throw new Error(`progress stuck at ${text} (seen ${seen.join(", ")})`);
        if (seen.length === 2) await screenshot(page, "batch-progress-running-desktop");
        await page.waitForTimeout(150);
      }
      assert(seen[0] < 100, `the batch was finished before the page could watch it (seen ${seen.join(", ")})`);
      assert(seen.every((p, i) => i === 0 || p > seen[i - 1]), `progress went backwards: ${seen.join(", ")}`);
      assert((await page.evaluate(() => window.__noReload)) === "still here", "the page reloaded");
      assert(page.url() === batchUrl, `navigated away to ${page.url()}`);
      assert((await page.getByTestId("count-done").textContent()).trim() === "4", "not all 4 variants done");
      assert((await page.getByTestId("progress-bar").getAttribute("aria-valuenow")) === "100", "progressbar value");
      const rows = page.getByTestId("variant-runs").locator("tbody tr");
      assert((await rows.count()) === 4, "4 variant rows expected");
      const states = await rows.evaluateAll((trs) => trs.map((tr) => tr.getAttribute("data-state")));
      assert(states.every((s) => s === "done"), `variant states: ${states.join(", ")}`);
      assert(!(await page.getByTestId("cancel-batch").isVisible().catch(() => false)), "cancel button still shown on a finished batch");
      await page.waitForTimeout(700); // let the bar finish its transition
      await screenshot(page, "batch-progress-done-desktop");

      // The finish mail: the worker sends it through the local SMTP catcher into the admin outbox.
      const admin = await newPage();
      await signIn(admin, baseUrl, "admin");
      let mail = null;
      const mailDeadline = Date.now() + 30_000;
      while (!mail && Date.now() < mailDeadline) {
        mail = (await outbox(admin)).find((m) => m.to.includes("researcher@wavesieve.test") && m.subject === "Batch screened: tidal-bore-sweep.yaml");
        if (!mail) await admin.waitForTimeout(500);
      }
      assert(mail, "no 'Batch screened' mail in the outbox");
      assert(mail.text.includes(`/batches/${batchId}`), "the mail does not link the batch");
      assert(/reducible:\s+\d+/.test(mail.text) && /undecided:\s+\d+/.test(mail.text), `counts missing from the mail: ${mail.text}`);

      // The Overview's Queue panel shows the finished runs.
      await page.goto(`${baseUrl}/overview`);
      await page.getByTestId("queue-panel").waitFor();
      assert(Number(await page.getByTestId("queue-done").textContent()) >= 4, "queue panel does not count the done runs");
      await screenshot(page, "overview-queue-desktop");
    },
  },
];
