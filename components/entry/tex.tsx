/**
 * KaTeX rendering. Used from server components (HTML rendered on the server, no client JS) and
 * from client components alike. A formula KaTeX cannot parse is shown as its source in red
 * (throwOnError: false), never as a broken page.
 */
import katex from "katex";

export function texToHtml(latex: string, display: boolean): string {
  return katex.renderToString(latex, { displayMode: display, throwOnError: false, strict: "ignore", trust: false, maxSize: 50, maxExpand: 2000 });
}

export function Tex({ latex, display = false, className = "" }: { latex: string; display?: boolean; className?: string }) {
  const html = texToHtml(latex, display);
  return display ? (
    <div className={`relative overflow-x-auto overflow-y-hidden py-1 ${className}`} data-testid="tex" dangerouslySetInnerHTML={{ __html: html }} />
  ) : (
    <span className={className} data-testid="tex" dangerouslySetInnerHTML={{ __html: html }} />
  );
}
