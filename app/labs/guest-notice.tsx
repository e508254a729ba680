import { CopyExamplesButton } from "./first-steps";

/** Shown on a public lab's pages to a guest: read only here, copies are where the work happens. */
export function GuestNotice({ slug }: { slug: string }) {
  return (
    <div className="flex flex-wrap items-center justify-between gap-3 rounded-md bg-accent-soft px-4 py-3 text-sm" data-testid="guest-notice">
      <p className="max-w-prose text-accent-strong">
        Worked examples, read only for everyone signed in. To edit them or run analyses, copy them into a lab of your own.
      </p>
      <CopyExamplesButton from={slug} />
    </div>
  );
}
