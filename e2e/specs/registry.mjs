// The registry as people use it: a researcher's families are screened into it, a curator accepts one
// from the review queue (and the history shows it), a viewer filters, sorts, opens an entry with its
// formulas and plots and exports CSV, and a viewer cannot reach curation actions (UI or API).
import { spawnSync } from "node:child_process";
import { readFileSync } from "node:fs";
import path from "node:path";
import { ROOT, VIEWPORTS, assert, screenshot, signIn } from "../harness.mjs";

const FIXTURE = path.join(ROOT, "e2e", "fixtures", "registry-families.yaml");
const BALANCED = "Erbium fibre amplifier with balanced gain";

async function entryIds(page) {
  const res = await page.request.get("/api/registry?size=100");
  assert(res.ok(), `registry list: ${res.status()}`);
  const body = await res.json();
  return Object.fromEntries(body.rows.map((r) => [r.slug, r.id]));
}

async function canvasSignature(page) {
  return page.getByTestId("solution-heatmap").locator("canvas").evaluate((c) => {
    const d = c.getContext("2d").getImageData(0, 0, c.width, c.height).data;
    let sum = 0;
    let lit = 0;
    for (let i = 0; i < d.length; i += 4 * 97) {
      sum = (sum * 31 + d[i] + 2 * d[i + 1] + 3 * d[i + 2]) % 1_000_000_007;
      if (d[i + 3] > 0) lit++;
    }
    return { sum, lit };
  });
}

export const tests = [
  {
    name: "registry: a researcher's uploaded families are screened into the registry",
    async run({ newPage, baseUrl, env }) {
      const page = await newPage();
      await signIn(page, baseUrl, "researcher");
      const res = await page.request.post("/api/batches", { data: { files: [{ name: "registry-families.yaml", text: readFileSync(FIXTURE, "utf8") }] } });
      assert(res.status() === 201, `upload: ${res.status()} ${await res.text()}`);
      const batchId = (await res.json()).batch.id;
      // The harness runs the real queue worker; wait until it has screened every member of this batch.
      const deadline = Date.now() + 240_000;
      let rows = [];
      while (Date.now() < deadline) {
        rows = (await (await page.request.get(`/api/registry?size=100&batch=${batchId}`)).json()).rows;
        if (rows.length === 4 && rows.every((r) => r.variants.screened === r.variants.total)) break;
        await new Promise((r) => setTimeout(r, 1000));
      }
      assert(rows.length === 4 && rows.every((r) => r.variants.screened === r.variants.total), `not screened in time: ${JSON.stringify(rows.map((r) => [r.slug, r.variants]))}`);
      const verdicts = Object.fromEntries(rows.map((r) => [r.slug, `${r.reducibility}/${r.painleve}`]));
      assert(verdicts["amp-balanced-gain"] === "reducible/passes" && verdicts["amp-excess-gain"] === "not-reducible/fails", `verdicts: ${JSON.stringify(verdicts)}`);
      // The synchronous path (no worker) finds nothing left to screen and changes nothing.
      const run = spawnSync(path.join(ROOT, "node_modules/.bin/tsx"), ["scripts/screen-and-record.ts", "--seed", "1"], { cwd: ROOT, env, encoding: "utf8", timeout: 300_000 });
      assert(run.status === 0, `screen-and-record exited ${run.status}: ${run.stdout}\n${run.stderr}`);
      const summary = JSON.parse(run.stdout.trim().split("\n").at(-1));
      assert(summary.screened === 0 && summary.failed === 0, `screen-and-record: ${run.stdout}`);
    },
  },
  {
    name: "registry: a curator accepts a candidate from the review queue and the history shows it",
    async run({ newPage, baseUrl }) {
      const page = await newPage();
      await signIn(page, baseUrl, "curator");
      await page.goto(`${baseUrl}/review`);
      const candidates = page.getByTestId("review-candidates");
      await candidates.waitFor();
      assert((await candidates.textContent()).includes(BALANCED), "candidate not in the review queue");
      await screenshot(page, "review-desktop");
      await candidates.getByRole("link", { name: BALANCED }).click();
      await page.getByTestId("curation-panel").waitFor();
      const note = "Gain balance checked against the span model.";
      await page.getByTestId("curation-note").fill(note);
      await page.getByRole("button", { name: "Accept", exact: true }).click();
      const history = page.getByTestId("history");
      await history.getByText(note).waitFor();
      const first = await page.getByTestId("history-item").first().textContent();
      assert(first.includes("curator@wavesieve.test") && first.includes("accepted") && first.includes("candidate → accepted"), `history: ${first}`);
      await page.getByRole("button", { name: "Publish" }).click();
      await page.getByTestId("history-item").nth(1).waitFor();
      assert((await page.getByTestId("history-item").nth(1).textContent()).includes("published"), "publish not in history");

      // The other entries are accepted and published through the API, as a script would.
      const ids = await entryIds(page);
      for (const slug of ["amp-excess-gain", "dark-pulse-span", "shelf-long-wave"]) {
        const a = await page.request.post(`/api/entries/${ids[slug]}/curate`, { data: { action: "accept", note: "batch review" } });
        assert(a.ok(), `accept ${slug}: ${a.status()} ${await a.text()}`);
        const p = await page.request.post(`/api/entries/${ids[slug]}/publish`, { data: { published: true } });
        assert(p.ok(), `publish ${slug}: ${p.status()}`);
      }
    },
  },
  {
    name: "registry: a viewer filters to reducible NLS entries with a tag, sorts by date, exports CSV and opens an entry with formulas and plots",
    async run({ newPage, baseUrl }) {
      const page = await newPage();
      await signIn(page, baseUrl, "viewer");
      await page.goto(`${baseUrl}/registry`);
      await page.getByTestId("registry-row").first().waitFor();
      await page.getByRole("combobox", { name: "Class" }).selectOption({ label: "vc-NLS" });
      await page.waitForURL(/class=nls/);
      await page.getByRole("combobox", { name: "Reducibility" }).selectOption({ label: "reducible" });
      await page.waitForURL(/reducibility=reducible/);
      const tags = page.getByLabel("Tags (all of)");
      await tags.fill("fibre");
      await tags.press("Enter");
      await page.waitForURL(/tags=fibre/);
      await page.getByTestId("registry-count").getByText("2 entries match").waitFor();
      const titles = async () => (await page.getByTestId("registry-row").locator("td:first-child a").allTextContents()).map((s) => s.trim());
      const before = await titles();
      assert(before.length === 2 && before.includes(BALANCED) && before.includes("Dark pulse in a lossless normal-dispersion span"), `filtered rows: ${before}`);

      // Sort by submission date: the header is a real button and aria-sort follows it.
      const header = page.getByRole("columnheader", { name: /Submitted/ });
      assert((await header.getAttribute("aria-sort")) === "descending", "default sort is newest first");
      await header.getByRole("button").click();
      await page.waitForURL(/sort=created&dir=asc/);
      await page.waitForFunction(() => document.querySelector('th[aria-sort="ascending"]')?.textContent?.includes("Submitted"));
      await page.waitForFunction((first) => document.querySelector('[data-testid="registry-row"] td a')?.textContent?.trim() !== first, before[0]);
      const after = await titles();
      assert(JSON.stringify(after) === JSON.stringify([...before].reverse()), `sorted rows: ${after} (before ${before})`);
      await screenshot(page, "registry-desktop");

      // The shared link reproduces the view.
      const link = page.url();
      const phone = await newPage(VIEWPORTS.phone);
      await signIn(phone, baseUrl, "viewer");
      await phone.goto(link);
      await phone.getByTestId("registry-count").getByText("2 entries match").waitFor();
      await screenshot(phone, "registry-phone");
      const search = phone.getByLabel("Search title and notes");
      await search.fill("zzzz-no-such-entry");
      await search.press("Enter");
      await phone.getByTestId("registry-empty").getByText("No entries match these filters.").waitFor();

      // CSV export of the filtered set.
      const [download] = await Promise.all([page.waitForEvent("download"), page.getByTestId("export-csv").click()]);
      const csv = readFileSync(await download.path(), "utf8").trim().split(/\r?\n/);
      assert(csv[0].startsWith("id,slug,title,class,reducibility"), `csv header: ${csv[0]}`);
      assert(csv.length === 3 && csv.slice(1).every((l) => l.includes(",nls,reducible,")), `csv rows: ${csv.join(" | ")}`);

      // The column choice is remembered in this browser.
      assert((await page.getByRole("columnheader", { name: /Engine/ }).count()) === 0, "engine column shown by default");
      await page.getByText("Columns", { exact: true }).click();
      await page.getByRole("checkbox", { name: "Engine" }).check();
      await page.getByRole("columnheader", { name: /Engine/ }).waitFor();
      await page.reload();
      await page.getByTestId("registry-row").first().waitFor();
      await page.getByRole("columnheader", { name: /Engine/ }).waitFor();

      // The entry page: KaTeX formulas, recharts plots, the |u|² heat map, the safety caution.
      await page.getByRole("link", { name: BALANCED }).click();
      await page.getByTestId("normal-form").waitFor();
      assert((await page.getByTestId("normal-form").locator(".katex").count()) > 0, "normal form not rendered by KaTeX");
      assert((await page.getByTestId("submitted-coefficients").locator(".katex").count()) >= 3, "submitted coefficients not rendered");
      assert(await page.getByTestId("safety-caution").isVisible(), "no safety caution on a fibre-amplifier entry");
      assert((await page.getByTestId("curation-panel").count()) === 0, "viewer sees the curation panel");
      await screenshot(page, "registry-entry-desktop");
      const formulas = page.getByTestId("transformation-formulas");
      await formulas.waitFor();
      assert((await formulas.locator(".katex").count()) >= 5, "transformation formulas missing");
      await page.getByTestId("coefficient-chart").locator(".recharts-line-curve").first().waitFor({ state: "attached" });
      await page.getByTestId("map-chart").locator(".recharts-line-curve").first().waitFor({ state: "attached" });
      await page.getByTestId("verification").waitFor();
      const explorer = page.getByTestId("solution-explorer");
      await explorer.scrollIntoViewIfNeeded();
      await page.getByTestId("solution-profile").locator(".recharts-line-curve").first().waitFor({ state: "attached" });
      const drawn = await canvasSignature(page);
      assert(drawn.lit > 0, "heat map canvas is blank");
      await page.getByTestId("param-eta").fill("2");
      await page.waitForFunction((old) => {
        const c = document.querySelector('[data-testid="solution-heatmap"] canvas');
        const d = c.getContext("2d").getImageData(0, 0, c.width, c.height).data;
        let sum = 0;
        for (let i = 0; i < d.length; i += 4 * 97) sum = (sum * 31 + d[i] + 2 * d[i + 1] + 3 * d[i + 2]) % 1_000_000_007;
        return sum !== old;
      }, drawn.sum);
      await page.getByTestId("solution-heatmap").scrollIntoViewIfNeeded();
      await screenshot(page, "registry-entry-plots-desktop");

      const entryUrl = page.url();
      const phoneEntry = await newPage(VIEWPORTS.phone);
      await signIn(phoneEntry, baseUrl, "viewer");
      await phoneEntry.goto(entryUrl);
      await phoneEntry.getByTestId("normal-form").waitFor();
      await screenshot(phoneEntry, "registry-entry-phone");
      await phoneEntry.getByTestId("solution-heatmap").scrollIntoViewIfNeeded();
      await phoneEntry.getByTestId("solution-profile").locator(".recharts-line-curve").first().waitFor({ state: "attached" });
      await screenshot(phoneEntry, "registry-entry-plots-phone");
      const width = await phoneEntry.evaluate(() => document.documentElement.scrollWidth);
      assert(width <= 390, `entry page scrolls sideways on a phone (${width}px)`);
    },
  },
  {
    name: "registry: a viewer cannot reach curation actions (UI and API)",
    async run({ newPage, baseUrl }) {
      const page = await newPage();
      await signIn(page, baseUrl, "viewer");
      const ids = await entryIds(page);
      const id = ids["amp-balanced-gain"];
      await page.goto(`${baseUrl}/registry/${id}`);
      await page.getByTestId("normal-form").waitFor();
      assert((await page.getByRole("button", { name: "Accept" }).count()) === 0, "viewer sees an Accept button");
      assert((await page.getByTestId("curation-panel").count()) === 0, "viewer sees the curation panel");
      await page.goto(`${baseUrl}/review`);
      await page.getByText("This page needs the curator role").waitFor();
      for (const [method, route, data] of [["post", "curate", { action: "reject", note: "x" }], ["patch", "tags", { tags: [] }], ["post", "duplicate", { duplicateOf: null }], ["post", "publish", { published: false }]]) {
        const res = await page.request[method](`/api/entries/${id}/${route}`, { data });
        assert(res.status() === 403, `viewer ${route}: ${res.status()}`);
      }
      const still = await (await page.request.get(`/api/registry?q=balanced`)).json();
      assert(still.rows[0]?.curationState === "accepted" && still.rows[0]?.published === true, "a viewer's request changed the entry");
    },
  },
];
