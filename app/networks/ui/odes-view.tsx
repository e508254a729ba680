import katex from "katex";
import "katex/dist/katex.min.css";
import { odeToLatex, odeToText, type SpeciesOde } from "../odes";

/**
 * The ODEs typeset by KaTeX (fonts come from node_modules through Vite; no CDN). Rendered to
 * HTML+MathML strings, the same on the server and in the browser; the plain-text form is kept
 * as the accessible label and for copying.
 */
export function OdesView({ odes }: { odes: SpeciesOde[] }) {
  return (
    <div className="space-y-1" data-testid="odes">
      {odes.map((ode) => (
        <div
          key={ode.species}
          className="overflow-x-auto py-1"
          title={odeToText(ode)}
          // KaTeX escapes every symbol it is given; names come from the validated CSV.
          dangerouslySetInnerHTML={{ __html: katex.renderToString(odeToLatex(ode), { displayMode: true, throwOnError: false, output: "htmlAndMathml" }) }}
        />
      ))}
    </div>
  );
}
