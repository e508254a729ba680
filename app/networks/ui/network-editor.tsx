import { useMemo, useRef, useState } from "react";
import { Form, useNavigation } from "react-router";
import { decodeNetworkFile, formatProblem, tryParseNetworkCsv, type NetworkFileProblem } from "@domain/network/index";
import { checkGrid, csvToGrid, emptyRow, MAX_CSV_BYTES, MAX_CSV_LABEL, moveRow, type GridRow } from "../grid";
import type { DemoNetwork } from "../demos";
import { importFormat, importNetworkText } from "../import-file";
import type { SbmlReactionReport } from "@domain/network/sbml/index";

/** What the server said about the last save (the API error shape, as form data). */
export interface EditorFailure {
  error: { code: string; message: string; details?: { problems?: NetworkFileProblem[]; fields?: Record<string, string> } };
}

const inputCls = "w-full rounded-md border border-line bg-surface px-2 py-1 text-sm focus:border-accent focus:outline-none";
const cellCls = "w-full rounded-sm border border-transparent bg-transparent px-1.5 py-1 font-mono text-sm hover:border-line focus:border-accent focus:bg-surface focus:outline-none";

const GRID_COLUMNS = [
  { key: "reaction", label: "Reaction", placeholder: "E + S <-> C", width: "min-w-56" },
  { key: "rate", label: "Rate", placeholder: "k1", width: "w-24" },
  { key: "reverse_rate", label: "Reverse rate", placeholder: "k2", width: "w-24" },
  { key: "rate_value", label: "Rate value", placeholder: "1/2", width: "w-24" },
  { key: "reverse_rate_value", label: "Reverse value", placeholder: "0.1", width: "w-24" },
  { key: "label", label: "Label", placeholder: "binding", width: "w-36" },
] as const;

/**
 * Upload, start blank or from a demo, edit in a grid, see the problems as you type (the domain
 * parser in the browser), then save; the server checks again and nothing invalid is stored.
 * On a refused save the grid keeps every edit, and the server's problems are shown on the rows.
 */
export function NetworkEditor({
  mode,
  initialRows,
  initialConstants = "",
  initialValues = "",
  details,
  demos = [],
  failure,
}: {
  mode: "create" | "version";
  initialRows: GridRow[];
  /** Constant species as written after `# constant:`, e.g. `A = 2, ATP`. */
  initialConstants?: string;
  /** Initial concentrations as written after `# initial:`, e.g. `X = 1, Y = 1/2`. */
  initialValues?: string;
  details?: { name: string; description: string; tags: string };
  demos?: DemoNetwork[];
  failure?: EditorFailure | null;
}) {
  const [rows, setRows] = useState<GridRow[]>(initialRows);
  const [notices, setNotices] = useState<string[]>([]);
  const [fileProblems, setFileProblems] = useState<{ name: string; problems: readonly NetworkFileProblem[]; reactions?: readonly SbmlReactionReport[] } | null>(null);
  const [pasted, setPasted] = useState("");
  const [dragging, setDragging] = useState(false);
  const fileInput = useRef<HTMLInputElement>(null);
  const [constants, setConstants] = useState(initialConstants);
  const [initial, setInitial] = useState(initialValues);
  const check = useMemo(() => checkGrid(rows, constants, initial), [rows, constants, initial]);
  const blank = rows.every((r) => GRID_COLUMNS.every((c) => r[c.key].trim() === ""));
  const navigation = useNavigation();
  const saving = navigation.state === "submitting";
  // Server problems refer to the CSV the grid wrote, so they map to rows the same way; after
  // the next edit they describe a grid that no longer exists and the live check takes over.
  const [editedAfter, setEditedAfter] = useState<EditorFailure | null | undefined>(undefined);
  const serverProblems = failure && editedAfter !== failure ? (failure.error.details?.problems ?? []) : [];
  const fields = failure?.error.details?.fields ?? {};

  const edit = (next: (rows: GridRow[]) => GridRow[]) => {
    setRows(next);
    setEditedAfter(failure);
  };
  const update = (index: number, key: keyof GridRow, value: string) => edit((rs) => rs.map((r, i) => (i === index ? { ...r, [key]: value } : r)));

  async function loadFile(file: File) {
    if (file.size > MAX_CSV_BYTES) {
      setNotices([`${file.name} is ${Math.ceil(file.size / 1024)} KB; the limit is ${MAX_CSV_LABEL}.`]);
      return;
    }
    // Bytes first: a binary file or another encoding gets one located line, and the grid stays as it was.
    const decoded = decodeNetworkFile(new Uint8Array(await file.arrayBuffer()));
    if (!decoded.ok) {
      setNotices([]);
      setFileProblems({ name: file.name, problems: [decoded.problem] });
      return;
    }
    const text = decoded.text;
    const format = importFormat(file.name, file.type, text);
    if (format !== "csv") {
      // SBML or a reaction list: read in full first; a refused file leaves the grid as it was
      // and lists each problem (line, element id) and what became of every reaction.
      const r = importNetworkText(text, format);
      if (!r.ok) {
        setNotices(r.notes);
        setFileProblems({ name: file.name, problems: r.problems, reactions: r.reactions });
        return;
      }
      const read = csvToGrid(r.csv);
      edit(() => read.rows.map((row) => ({ ...row, sourceLine: undefined })));
      setConstants(read.constants);
      setInitial(read.initial);
      setNotices([`${file.name} read as ${format === "sbml" ? "SBML" : "a reaction list"}.`, ...r.notes]);
      setFileProblems(null);
      return;
    }
    const loaded = csvToGrid(text);
    if (loaded.dropped.length > 0) {
      // Loading would lose these cells (rate names under an unknown column, say): refuse, and name them.
      setNotices([`Nothing was loaded from ${file.name}: the grid has no place for some of its data. Rename or remove the columns below and upload it again.`]);
      setFileProblems({ name: file.name, problems: loaded.dropped });
      return;
    }
    const parsed = tryParseNetworkCsv(text);
    edit(() => loaded.rows);
    setConstants(loaded.constants);
    setInitial(loaded.initial);
    setNotices(loaded.notices);
    setFileProblems({ name: file.name, problems: parsed.ok ? [] : parsed.problems });
  }

  function loadPasted() {
    const r = importNetworkText(pasted, "text");
    if (!r.ok) {
      setNotices([]);
      setFileProblems({ name: "Pasted reactions", problems: r.problems });
      return;
    }
    const read = csvToGrid(r.csv);
    edit(() => read.rows.map((row) => ({ ...row, sourceLine: undefined })));
    setConstants(read.constants);
    setInitial(read.initial);
    setNotices([]);
    setFileProblems(null);
  }

  function loadDemo(demo: DemoNetwork) {
    const loaded = csvToGrid(demo.csv);
    edit(() => loaded.rows.map((r) => ({ ...r, sourceLine: undefined })));
    setConstants(loaded.constants);
    setInitial(loaded.initial);
    setNotices([]);
    setFileProblems(null);
  }

  return (
    <Form method="post" className="space-y-6" data-testid="network-editor">
      {failure && (
        <div role="alert" className="rounded-md bg-danger-soft px-4 py-3 text-sm text-danger" data-testid="save-error">
          {failure.error.message}
          {serverProblems.length > 0 && " The rows with problems are marked below; your edits are kept."}
        </div>
      )}

      {mode === "create" && details && (
        <fieldset className="grid grid-cols-1 gap-4 md:grid-cols-2">
          <label className="space-y-1 text-sm font-medium">
            Name
            <input name="name" defaultValue={details.name} required maxLength={200} className={inputCls} aria-invalid={Boolean(fields.name)} />
            {fields.name && <span className="text-xs text-danger">{fields.name}</span>}
          </label>
          <label className="space-y-1 text-sm font-medium">
            Tags <span className="font-normal text-muted">(comma-separated)</span>
            <input name="tags" defaultValue={details.tags} className={inputCls} placeholder="enzyme, teaching" />
            {fields.tags && <span className="text-xs text-danger">{fields.tags}</span>}
          </label>
          <label className="space-y-1 text-sm font-medium md:col-span-2">
            Description
            <textarea name="description" defaultValue={details.description} rows={2} className={inputCls} />
          </label>
        </fieldset>
      )}

      <div className="grid grid-cols-1 gap-4 md:grid-cols-[minmax(0,1fr)_auto]">
        <div
          className={`flex flex-col items-center justify-center gap-2 rounded-card border-2 border-dashed px-6 py-5 text-center text-sm ${dragging ? "border-accent bg-accent-soft" : "border-line bg-surface"}`}
          onDragOver={(e) => {
            e.preventDefault();
            setDragging(true);
          }}
          onDragLeave={() => setDragging(false)}
          onDrop={(e) => {
            e.preventDefault();
            setDragging(false);
            const file = e.dataTransfer.files[0];
            if (file) void loadFile(file);
          }}
          data-testid="drop-zone"
        >
          <p>
            Drop a network file here, or{" "}
            <button type="button" className="font-medium text-accent-strong underline" onClick={() => fileInput.current?.click()}>
              choose a file
            </button>
            .
          </p>
          <p className="text-xs text-muted">
            CSV with a header row (<code>reaction,rate,reverse_rate,rate_value,reverse_rate_value,label</code>), comma or semicolon, an optional <code># constant: A = 2, B</code> line for species held constant and an optional <code># initial: S = 10, E = 1</code> line for initial concentrations; SBML (<code>.xml</code>, <code>.sbml</code>,
            mass-action rate laws); or a reaction list (<code>.txt</code>). At most {MAX_CSV_LABEL}. It is read here in your browser first; nothing is saved until you press Save.
          </p>
          <input
            ref={fileInput}
            type="file"
            accept=".csv,.txt,.xml,.sbml,text/csv,text/plain,application/xml,text/xml,application/sbml+xml"
            className="sr-only"
            aria-label="Network file"
            data-testid="file-input"
            onChange={(e) => {
              const file = e.target.files?.[0];
              if (file) void loadFile(file);
              e.target.value = "";
            }}
          />
        </div>
        {mode === "create" && (
          <div className="space-y-2 text-sm">
            <p className="font-medium">Or start from</p>
            <div className="flex flex-col gap-1.5">
              <button type="button" className="btn-quiet justify-start py-1.5" onClick={() => loadDemo({ id: "blank", title: "", summary: "", csv: "" })}>
                A blank grid
              </button>
              {demos.map((d) => (
                <button key={d.id} type="button" className="btn-quiet justify-start py-1.5" title={d.summary} onClick={() => loadDemo(d)}>
                  {d.title}
                </button>
              ))}
            </div>
          </div>
        )}
      </div>

      {notices.length > 0 && (
        <ul className="space-y-1 rounded-md bg-signal-soft px-4 py-2 text-sm text-signal" data-testid="editor-notices">
          {notices.map((n) => (
            <li key={n}>{n}</li>
          ))}
        </ul>
      )}
      {fileProblems && fileProblems.problems.length > 0 && (
        <details className="rounded-md border border-line bg-surface px-4 py-2 text-sm" open>
          <summary className="cursor-pointer font-medium">
            {fileProblems.name}: {fileProblems.problems.length} problem{fileProblems.problems.length === 1 ? "" : "s"} in the file as uploaded (line numbers of your file)
          </summary>
          <ul className="mt-2 list-disc pl-5 text-muted" data-testid="file-problems">
            {fileProblems.problems.map((p, i) => (
              <li key={i}>{formatProblem(p)}</li>
            ))}
          </ul>
          {fileProblems.reactions && fileProblems.reactions.length > 0 && (
            <table className="mt-3 w-full text-xs" data-testid="file-reactions">
              <thead className="text-left text-muted">
                <tr>
                  <th className="py-1 pr-3 font-medium">Reaction</th>
                  <th className="py-1 pr-3 font-medium">As read</th>
                  <th className="py-1 font-medium">Outcome</th>
                </tr>
              </thead>
              <tbody>
                {fileProblems.reactions.map((r) => (
                  <tr key={`${r.id}-${r.line}`} className="border-t border-line">
                    <td className="py-1 pr-3 font-mono">{r.id} <span className="text-faint">L{r.line}</span></td>
                    <td className="py-1 pr-3 font-mono">{r.text}</td>
                    <td className={`py-1 ${r.status === "read" ? "text-ok" : "text-danger"}`}>{r.status === "read" ? "mass action, read" : r.reasons.join("; ")}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          )}
        </details>
      )}

      <details className="rounded-md border border-line bg-surface px-4 py-2 text-sm" data-testid="paste-reactions">
        <summary className="cursor-pointer font-medium">Paste reactions as text</summary>
        <p className="mt-2 text-xs text-muted">
          One reaction per line: <code>binding: E + S &lt;-&gt; C, kon = 2, koff = 1</code>. A label before <code>:</code> and the rates after commas are optional
          (<code>NAME</code>, <code>NAME = VALUE</code> or a value alone); <code>#</code> starts a comment. This replaces the grid below.
        </p>
        <textarea
          value={pasted}
          onChange={(e) => setPasted(e.target.value)}
          rows={5}
          className={`${inputCls} mt-2 font-mono`}
          aria-label="Reactions as text"
          placeholder={"E + S <-> C, kon = 2, koff = 1\nC -> E + P, kcat = 3"}
        />
        <button type="button" className="btn-quiet mt-2 py-1.5" onClick={loadPasted} disabled={pasted.trim() === ""}>
          Read into the grid
        </button>
      </details>

      <div className="space-y-2">
        <div className="flex items-baseline justify-between gap-4">
          <h2 className="text-lg font-semibold">Reactions</h2>
          <p className={`text-sm ${blank ? "text-muted" : check.ok ? "text-ok" : "text-danger"}`} aria-live="polite" data-testid="grid-status">
            {blank
              ? "Type a reaction such as E + S <-> C, upload a file, or start from a demo."
              : check.ok
                ? `Looks valid: ${rows.filter((r) => r.reaction.trim() !== "").length} rows.`
                : `${check.count} problem${check.count === 1 ? "" : "s"} to fix before saving.`}
          </p>
        </div>
        {check.general.length > 0 && !blank && (
          <ul className="rounded-md bg-danger-soft px-4 py-2 text-sm text-danger">
            {check.general.map((p, i) => (
              <li key={i}>{p.message}{p.expected ? ` (expected ${p.expected})` : ""}</li>
            ))}
          </ul>
        )}
        <div className="overflow-x-auto rounded-card border border-line bg-surface">
          <table className="w-full text-sm" data-testid="reaction-grid">
            <thead className="border-b border-line bg-sunken text-left text-xs uppercase tracking-wide text-muted">
              <tr>
                <th className="px-2 py-2">#</th>
                {GRID_COLUMNS.map((c) => (
                  <th key={c.key} className={`px-2 py-2 font-medium ${c.width}`}>
                    {c.label}
                  </th>
                ))}
                <th className="px-2 py-2 text-right font-medium">Order</th>
              </tr>
            </thead>
            <tbody>
              {rows.map((row, i) => {
                const problems = check.byRow.get(i) ?? [];
                const fromServer = serverProblems.filter((p) => p.row - 2 === i && !problems.some((q) => q.message === p.message));
                const all = [...problems, ...fromServer];
                const bad = new Set(all.map((p) => p.column));
                return [
                  <tr key={row.key} className={`border-t border-line ${all.length ? "bg-danger-soft" : ""}`} data-testid="grid-row" data-invalid={all.length > 0 ? "true" : "false"}>
                    <td className="px-2 py-1 text-xs text-muted" title={row.sourceLine ? `line ${row.sourceLine} of the uploaded file` : undefined}>
                      {i + 1}
                      {row.sourceLine ? <span className="block text-faint">L{row.sourceLine}</span> : null}
                    </td>
                    {GRID_COLUMNS.map((c) => (
                      <td key={c.key} className="px-1 py-1">
                        <input
                          value={row[c.key]}
                          onChange={(e) => update(i, c.key, e.target.value)}
                          // Enter in a cell should not save half-typed work; it adds a row below the last one.
                          onKeyDown={(e) => {
                            if (e.key !== "Enter") return;
                            e.preventDefault();
                            if (i === rows.length - 1) edit((rs) => [...rs, emptyRow()]);
                          }}
                          placeholder={rows.length === 1 && GRID_COLUMNS.every((k) => row[k.key] === "") ? c.placeholder : undefined}
                          aria-label={`${c.label}, row ${i + 1}`}
                          aria-invalid={bad.has(c.key)}
                          className={`${cellCls} ${bad.has(c.key) ? "border-danger bg-surface" : ""}`}
                        />
                      </td>
                    ))}
                    <td className="whitespace-nowrap px-2 py-1 text-right">
                      <button type="button" className="px-1 text-muted hover:text-ink disabled:opacity-30" aria-label={`Move row ${i + 1} up`} disabled={i === 0} onClick={() => edit((rs) => moveRow(rs, i, i - 1))}>
                        ↑
                      </button>
                      <button type="button" className="px-1 text-muted hover:text-ink disabled:opacity-30" aria-label={`Move row ${i + 1} down`} disabled={i === rows.length - 1} onClick={() => edit((rs) => moveRow(rs, i, i + 1))}>
                        ↓
                      </button>
                      <button type="button" className="px-1 text-muted hover:text-danger" aria-label={`Remove row ${i + 1}`} onClick={() => edit((rs) => (rs.length === 1 ? [emptyRow()] : rs.filter((_, j) => j !== i)))}>
                        ✕
                      </button>
                    </td>
                  </tr>,
                  all.length > 0 && (
                    <tr key={`${row.key}-problems`} className="bg-danger-soft">
                      <td />
                      <td colSpan={GRID_COLUMNS.length + 1} className="px-2 pb-2 text-xs text-danger" data-testid="row-problems">
                        {all.map((p, k) => (
                          <div key={k}>
                            {p.column ? <strong>{p.column}: </strong> : null}
                            {p.message}
                            {p.expected ? ` — expected ${p.expected}` : ""}
                          </div>
                        ))}
                      </td>
                    </tr>
                  ),
                ];
              })}
            </tbody>
          </table>
        </div>
        <button type="button" className="btn-quiet py-1.5" onClick={() => edit((rs) => [...rs, emptyRow()])}>
          + Add a reaction
        </button>
      </div>

      <DirectiveField
        id="constants"
        label="Constant species"
        value={constants}
        onChange={(v) => {
          setConstants(v);
          setEditedAfter(failure);
        }}
        placeholder="A = 2, B"
        problems={check.constants}
        hint={
          <>
            Species held at a fixed concentration, such as a feed or a buffered cofactor: <code>A = 2, ATP</code>. Without a value the concentration stays symbolic, like a rate constant.
          </>
        }
      />
      <DirectiveField
        id="initial"
        label="Initial concentrations"
        value={initial}
        onChange={(v) => {
          setInitial(v);
          setEditedAfter(failure);
        }}
        placeholder="S = 10, E = 1, C = 0"
        problems={check.initial}
        hint={
          <>
            Stored with the version as a <code># initial: S = 10, E = 1</code> line: the starting point that analyses and time courses offer (you can still change it there). Values ≥ 0, decimals or fractions; held species take their value from the field above.
          </>
        }
      />

      <input type="hidden" name="csv" value={check.csv} />
      <div className="flex flex-wrap items-end gap-4 border-t border-line pt-4">
        <label className="min-w-64 flex-1 space-y-1 text-sm font-medium">
          Change note <span className="font-normal text-muted">(kept with this version)</span>
          <input name="changeNote" maxLength={500} className={inputCls} placeholder={mode === "create" ? "First version." : "What changed, in a few words"} />
        </label>
        <button type="submit" className="btn-primary" disabled={saving}>
          {saving ? "Saving…" : mode === "create" ? "Save network" : "Save as new version"}
        </button>
      </div>
    </Form>
  );
}

/**
 * One `# constant:` / `# initial:` line of the file as a text field, with its hint and located
 * problems. The hint sits outside the label so the field's accessible name stays the label.
 */
function DirectiveField({ id, label, value, onChange, placeholder, problems, hint }: {
  id: "constants" | "initial";
  label: string;
  value: string;
  onChange: (value: string) => void;
  placeholder: string;
  problems: readonly NetworkFileProblem[];
  hint: React.ReactNode;
}) {
  return (
    <div className="space-y-1">
      <label className="block space-y-1 text-sm font-medium">
        {label}
        <input
          aria-describedby={`${id}-hint`}
          value={value}
          onChange={(e) => onChange(e.target.value)}
          placeholder={placeholder}
          aria-invalid={problems.length > 0}
          className={`${inputCls} ${problems.length > 0 ? "border-danger" : ""}`}
          data-testid={`${id}-input`}
        />
      </label>
      <p id={`${id}-hint`} className="text-xs text-muted">
        {hint}
      </p>
      {problems.length > 0 && (
        <ul className="text-xs text-danger" data-testid={`${id}-problems`}>
          {problems.map((p, i) => (
            <li key={i}>
              {p.message}
              {p.expected ? ` — expected ${p.expected}` : ""}
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
