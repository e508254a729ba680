import "katex/dist/katex.min.css";
import { katexHtml } from "~/components/render-cache";

/** One formula typeset by KaTeX (same HTML on server and client; fonts from node_modules, no CDN; remembered by formula). */
export function Tex({ tex, display = false }: { tex: string; display?: boolean }) {
  const html = katexHtml(tex, display);
  return <span className={display ? "block overflow-x-auto" : ""} dangerouslySetInnerHTML={{ __html: html }} />;
}

/**
 * A formula: typeset when the engine wrote its TeX, else its plain text in a code face (results
 * stored before the engine wrote TeX; the page says so once, above the results).
 */
export function Formula({ tex, text, display = false }: { tex: string | null; text: string; display?: boolean }) {
  if (tex !== null) return <Tex tex={tex} display={display} />;
  return <code className={`font-mono text-sm ${display ? "block overflow-x-auto py-1" : ""}`} data-testid="formula-text">{text}</code>;
}
