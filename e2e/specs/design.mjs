// Design mode as a researcher uses it: open Design, fix a dispersion profile and a loss, solve for
// the nonlinearity, read the formula and the plot, submit the designed family, find it in the
// batches, and (the harness runs the queue worker) see its registry entry screened as reducible.
import { assert, screenshot, signIn } from "../harness.mjs";

const SLUG = "designed-nls-h";

export const tests = [
  {
    name: "design: a researcher solves for the nonlinearity of a tapered lossy fibre, submits it and finds it screened",
    async run({ newPage, baseUrl }) {
      const page = await newPage();
      await signIn(page, baseUrl, "researcher");
      await page.getByRole("link", { name: "Design", exact: true }).click();
      await page.waitForURL(`${baseUrl}/design`);
      await page.getByTestId("design-coefficients").waitFor();

      // A dispersion that weakens along the fibre and a constant loss; the nonlinearity h is unknown.
      await page.getByLabel("Class").selectOption("nls");
      await page.getByLabel("Solve for h").check();
      await page.getByLabel("Coefficient a").fill("(1 + 0.3*t)/2");
      await page.getByLabel("Coefficient k").fill("0.04");
      await page.getByLabel("Window start").fill("0");
      await page.getByLabel("Window end").fill("6");
      await page.getByRole("button", { name: "Solve for h" }).click();

      const formula = page.getByTestId("design-formula");
      await formula.waitFor({ timeout: 60_000 });
      const text = (await page.getByTestId("design-text").textContent()).trim();
      assert(text.includes("h0") && text.includes("alpha0") && text.includes("exp"), `formula text: ${text}`);
      assert((await formula.locator(".katex").count()) >= 2, "the formula is not typeset");
      assert((await page.getByTestId("design-reducibility").textContent()).trim() === "reducible", "the designed model is not screened reducible");
      assert((await page.getByTestId("design-verdict").textContent()).includes("Painlevé passes"), "Painlevé verdict missing");
      // The plot: the solved h next to the fixed a and k, drawn by recharts.
      const solvedChart = page.getByTestId("design-plot-solved");
      await solvedChart.locator(".recharts-line path").first().waitFor();
      const fixedLines = await page.getByTestId("design-plot-fixed").locator(".recharts-line").count();
      assert(fixedLines === 2, `fixed-coefficient curves: ${fixedLines}`);
      const yaml = await page.getByTestId("design-yaml").textContent();
      assert(yaml.includes(`id: ${SLUG}`) && yaml.includes("# designed"), `YAML: ${yaml}`);
      await formula.scrollIntoViewIfNeeded();
      await screenshot(page, "design-result-desktop");
      await page.getByTestId("design-plot").scrollIntoViewIfNeeded();
      await screenshot(page, "design-plot-desktop");

      // Edit a constant (the chirp at t0) and solve again: still a closed form, still reducible.
      await page.getByLabel("Constant alpha0").fill("0.05");
      await page.getByRole("button", { name: "Solve again with these constants" }).click();
      await page.getByTestId("design-yaml").getByText("alpha0: 0.05").waitFor({ timeout: 60_000 });
      assert((await page.getByTestId("design-reducibility").textContent()).trim() === "reducible", "re-solved model not reducible");

      await page.getByTestId("design-submit").click();
      await page.getByText("Batch created").waitFor({ timeout: 60_000 });
      await page.getByRole("link", { name: "Open the batch" }).click();
      await page.getByTestId("batch-families").waitFor();
      assert((await page.getByTestId("batch-families").textContent()).includes(SLUG), "designed family missing on the batch page");
      await page.goto(`${baseUrl}/batches`);
      const table = await page.getByTestId("batches-table").textContent();
      assert(table.includes("Design: vc-NLS with h designed for R"), `batch not listed: ${table}`);

      // The queue worker screens the new family into the registry.
      const deadline = Date.now() + 180_000;
      let row = null;
      while (Date.now() < deadline) {
        const rows = (await (await page.request.get("/api/registry?size=100")).json()).rows ?? [];
        row = rows.find((r) => r.slug === SLUG) ?? null;
        if (row && row.variants.screened === row.variants.total) break;
        await new Promise((r) => setTimeout(r, 1000));
      }
      assert(row && row.variants.screened === row.variants.total, `not screened in time: ${JSON.stringify(row)}`);
      assert(row.reducibility === "reducible" && row.painleve === "passes", `registry verdict: ${row.reducibility}/${row.painleve}`);
    },
  },
  {
    name: "design: a bad request shows the located error, and a viewer cannot use Design",
    async run({ newPage, baseUrl }) {
      const page = await newPage();
      await signIn(page, baseUrl, "researcher");
      await page.goto(`${baseUrl}/design`);
      await page.getByLabel("Solve for b").check();
      await page.getByLabel("Coefficient a").fill("cos(t)");
      await page.getByLabel("Coefficient h").fill("1");
      await page.getByLabel("Window end").fill("3");
      await page.getByRole("button", { name: "Solve for b" }).click();
      const errors = page.getByTestId("design-errors");
      await errors.waitFor();
      const message = await errors.textContent();
      assert(message.includes("set.a") && message.includes("a vanishes at t = 1.5708"), `error: ${message}`);

      // A potential with no elementary solve: a numerical design, shown with its accuracy, not submittable.
      await page.getByLabel("Solve for h").check();
      await page.getByLabel("Coefficient a").fill("1/2");
      await page.getByLabel("Coefficient b").fill("-1/(8*(1 + t)^2)");
      await page.getByLabel("Window end").fill("2");
      await page.getByRole("button", { name: "Solve for h" }).click();
      await page.getByTestId("design-accuracy").waitFor({ timeout: 60_000 });
      assert((await page.getByTestId("design-verdict").textContent()).includes("numerical design"), "numerical design not marked");
      assert((await page.getByTestId("design-yaml").count()) === 0, "a tabulated design shows YAML");
      assert((await page.getByTestId("design-result").textContent()).length > 0, "no result");
      const body = { class: "nls", solve: "h", set: { a: "1/2", b: "-1/(8*(1 + t)^2)" }, window: [0, 2] };
      const refused = await page.request.post("/api/design/submit", { data: body });
      assert(refused.status() === 422 && (await refused.json()).error.includes("cannot be submitted"), `tabulated submit: ${refused.status()}`);

      const viewer = await newPage();
      await signIn(viewer, baseUrl, "viewer");
      assert((await viewer.getByRole("link", { name: "Design", exact: true }).count()) === 0, "viewer sees the Design link");
      await viewer.goto(`${baseUrl}/design`);
      await viewer.getByText("This page needs the researcher role").waitFor();
      const api = await viewer.request.post("/api/design", { data: { class: "nls", solve: "b", set: { a: "1", h: "1" }, window: [0, 1] } });
      assert(api.status() === 403, `viewer API status ${api.status()}`);
    },
  },
];
