import "katex/dist/katex.min.css";
import { katexHtml } from "~/components/render-cache";

/** One formula typeset by KaTeX (same HTML on server and client; fonts from node_modules, no CDN; remembered by formula). */
export function Tex({ tex, display = false }: { tex: string; display?: boolean }) {
  const html = katexHtml(tex, display);
  return <span className={display ? "block overflow-x-auto" : ""} dangerouslySetInnerHTML={{ __html: html }} />;
}
