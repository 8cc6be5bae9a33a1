// A researcher uploads two files on the Submit page (one with an error), reads the located error, submits, finds the batch.
import path from "node:path";
import { ROOT, assert, screenshot, signIn } from "../harness.mjs";

const fixtures = ["harbour-channel.yaml", "amplifier-drafts.yaml"].map((f) => path.join(ROOT, "e2e", "fixtures", f));

export const tests = [
  {
    name: "a researcher drops two files, sees the located error, submits and finds the batch listed",
    async run({ newPage, baseUrl }) {
      const page = await newPage();
      await signIn(page, baseUrl, "researcher");
      await page.goto(`${baseUrl}/submit`);
      await page.getByTestId("file-input").setInputFiles(fixtures);
      await page.getByTestId("file-report").nth(1).waitFor();
      const errors = page.getByTestId("located-error");
      await errors.first().waitFor();
      const errorText = await errors.first().textContent();
      assert(errorText.includes("amplifier-drafts.yaml") && errorText.includes("amp-draft-typo") && /line \d+/.test(errorText), `error not located: ${errorText}`);
      await screenshot(page, "submit-preview-desktop");
      const submit = page.getByRole("button", { name: /Submit 2 valid families/ });
      await submit.click();
      await page.getByText("Batch stored").waitFor();
      await page.getByRole("link", { name: "Open the batch" }).click();
      await page.getByTestId("batch-families").waitFor();
      const body = await page.getByTestId("batch-families").textContent();
      assert(body.includes("harbour-channel-narrowing") && body.includes("amp-draft-gain"), "families missing on batch page");
      await page.goto(`${baseUrl}/batches`);
      const table = await page.getByTestId("batches-table").textContent();
      assert(table.includes("harbour-channel.yaml, amplifier-drafts.yaml"), `batch not listed: ${table}`);
      await screenshot(page, "batches-desktop");
    },
  },
];
