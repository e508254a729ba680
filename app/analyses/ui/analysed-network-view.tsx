import type { AnalysedNetwork } from "~/analyses/analysed-network";

const th = "px-3 py-1.5 text-left text-xs font-medium uppercase tracking-wide text-muted";
const td = "px-3 py-1.5 align-top";

/** The reactions of the analysed version with the rate values the run used (an override beside the file's value). */
export function AnalysedNetworkView({ network }: { network: AnalysedNetwork }) {
  const value = (used: string | null, file: string | null) =>
    used === null ? <span className="text-faint">symbolic</span> : used !== file && file !== null ? <>{used} <span className="text-xs text-muted">(file: {file})</span></> : used;
  return (
    <div className="space-y-2">
      <div className="overflow-x-auto rounded-md border border-line bg-surface">
        <table className="w-full text-sm" data-testid="analysed-reactions">
          <thead className="border-b border-line bg-sunken">
            <tr>
              <th className={th}>#</th>
              <th className={th}>Reaction</th>
              <th className={th}>Rate constant</th>
              <th className={th}>Value used</th>
              <th className={th}>Label</th>
            </tr>
          </thead>
          <tbody>
            {network.reactions.map((r) => (
              <tr key={r.id} className="border-b border-line last:border-0" data-testid="analysed-reaction">
                <td className={`${td} text-muted`}>{r.id}</td>
                <td className={`${td} whitespace-nowrap font-mono`}>{r.reaction}</td>
                <td className={`${td} font-mono`}>{r.rate}</td>
                <td className={`${td} font-mono`} data-testid={`rate-value-${r.id}`}>
                  {value(r.usedValue, r.fileValue)}
                </td>
                <td className={td}>{r.label ?? ""}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {network.constants.length > 0 && (
        <p className="text-sm text-muted" data-testid="analysed-constants">
          Held constant:{" "}
          {network.constants.map((c, k) => (
            <span key={c.name}>
              {k > 0 ? ", " : ""}
              <span className="font-mono text-ink">{c.name}</span> = {value(c.usedValue, c.fileValue)}
            </span>
          ))}
        </p>
      )}
    </div>
  );
}
