/** The user documentation under docs/, rendered from Markdown we write ourselves (trusted input). */
import { readFile } from "node:fs/promises";
import path from "node:path";
import { marked } from "marked";

export const DOCS: Record<string, string> = {
  "family-format": "Family file format",
};

export async function renderDoc(slug: string): Promise<{ title: string; html: string } | null> {
  if (!Object.hasOwn(DOCS, slug)) return null;
  const text = await readFile(path.join(process.cwd(), "docs", `${slug}.md`), "utf8");
  return { title: DOCS[slug], html: await marked.parse(text) };
}
