import katex from "katex";
import "katex/dist/katex.min.css";

/** One formula typeset by KaTeX (same HTML on server and client; fonts from node_modules, no CDN). */
export function Tex({ tex, display = false }: { tex: string; display?: boolean }) {
  const html = katex.renderToString(tex, { displayMode: display, throwOnError: false, output: "htmlAndMathml" });
  return <span className={display ? "block overflow-x-auto" : ""} dangerouslySetInnerHTML={{ __html: html }} />;
}
