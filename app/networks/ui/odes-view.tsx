import "katex/dist/katex.min.css";
import type { SpeciesOde } from "@domain/steady-state/ode-terms";
import { katexHtml } from "~/components/render-cache";
import { odesAlignedLatex, odeToText } from "../odes";

/**
 * The ODEs typeset by KaTeX in one aligned block (fonts come from node_modules through Vite; no
 * CDN). Rendered to an HTML+MathML string, the same on the server and in the browser; the
 * plain-text forms follow for copying and screen readers. The HTML is remembered by formula.
 */
export function OdesView({ odes }: { odes: readonly SpeciesOde[] }) {
  const html = katexHtml(odesAlignedLatex(odes), true);
  return (
    <div data-testid="odes">
      {/* KaTeX escapes every symbol it is given; names come from the validated CSV. */}
      <div className="overflow-x-auto rounded-md border border-line bg-surface px-4 py-2" dangerouslySetInnerHTML={{ __html: html }} />
      <details className="mt-2 text-sm">
        <summary className="cursor-pointer text-muted">As plain text</summary>
        <ul className="mt-1 font-mono text-xs">
          {odes.map((o) => (
            <li key={o.species} data-testid="ode-text">
              {odeToText(o)}
            </li>
          ))}
        </ul>
      </details>
    </div>
  );
}
