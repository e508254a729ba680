import { useFetcher } from "react-router";
import { NAME_MAX, NOTE_MAX } from "~/analyses/run-limits";

type Problems = { problems?: { field: string; message: string }[]; saved?: string };

/**
 * The run's name and note (editors), archive (editors) and delete (owners). Viewers see the name
 * and note only. Each form posts one intent to the analysis page's action.
 */
export function RunDetails({ name, note, archived, canEdit, canDelete, busy }: { name: string; note: string; archived: boolean; canEdit: boolean; canDelete: boolean; busy: boolean }) {
  const details = useFetcher<Problems>();
  const archive = useFetcher<Problems>();
  const remove = useFetcher<Problems>();
  if (!canEdit)
    return note ? (
      <p className="max-w-prose whitespace-pre-line text-sm" data-testid="run-note">
        {note}
      </p>
    ) : null;
  const problems = [...(details.data?.problems ?? []), ...(remove.data?.problems ?? [])];
  return (
    <details className="rounded-card border border-line bg-surface px-4 py-2 text-sm" data-testid="run-details">
      <summary className="cursor-pointer font-medium">Name, note and archive</summary>
      <details.Form method="post" className="mt-3 space-y-2">
        <input type="hidden" name="intent" value="details" />
        <label className="block space-y-0.5">
          <span className="block text-xs text-muted">Name (up to {NAME_MAX} characters)</span>
          <input name="name" defaultValue={name} maxLength={NAME_MAX} className="w-full max-w-md rounded-md border border-line bg-surface px-2 py-1" />
        </label>
        <label className="block space-y-0.5">
          <span className="block text-xs text-muted">Note (up to {NOTE_MAX} characters)</span>
          <textarea name="note" defaultValue={note} maxLength={NOTE_MAX} rows={3} className="w-full max-w-prose rounded-md border border-line bg-surface px-2 py-1" />
        </label>
        <div className="flex items-center gap-3">
          <button className="rounded-md border border-accent px-3 py-1 font-medium text-accent-strong hover:bg-accent-soft">Save name and note</button>
          {details.state === "idle" && details.data?.saved && <span className="text-ok" role="status">Saved.</span>}
        </div>
      </details.Form>
      <div className="mt-3 flex flex-wrap items-center gap-3 border-t border-line pt-3">
        <archive.Form method="post">
          <input type="hidden" name="intent" value={archived ? "unarchive" : "archive"} />
          <button className="rounded-md border border-line px-3 py-1 hover:bg-sunken">{archived ? "Back into the list" : "Archive"}</button>
        </archive.Form>
        <span className="text-xs text-muted">{archived ? "Archived: hidden from the analyses list unless “Show archived” is ticked." : "Archiving hides the run from the list; nothing is deleted."}</span>
        {canDelete && (
          <remove.Form
            method="post"
            onSubmit={(e) => {
              if (!window.confirm("Delete this analysis with its scans, tests, time courses and share links? This cannot be undone.")) e.preventDefault();
            }}
          >
            <input type="hidden" name="intent" value="delete" />
            <button className="rounded-md border border-danger px-3 py-1 text-danger hover:bg-danger-soft" disabled={busy} title={busy ? "Cancel the run first" : undefined}>
              Delete
            </button>
          </remove.Form>
        )}
      </div>
      {problems.length > 0 && (
        <p role="alert" className="mt-2 text-danger">
          {problems.map((p) => p.message).join("; ")}
        </p>
      )}
    </details>
  );
}
