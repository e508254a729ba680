import { Link, isRouteErrorResponse } from "react-router";

/**
 * What a person sees when something went wrong: a status, a plain explanation and a way on.
 * Thrown 4xx responses are handled outcomes (their message is shown); anything else is a bug,
 * whose details are shown only in development.
 */
export function ErrorView({ error }: { error: unknown }) {
  let status = 500;
  let title = "Something went wrong";
  let message = "An unexpected error stopped this page. It has been logged; try again in a moment.";
  let details: string | undefined;

  if (isRouteErrorResponse(error)) {
    status = error.status;
    const fromData = typeof error.data === "string" ? error.data : (error.data?.error?.message ?? error.data?.message);
    if (status === 404) {
      title = "Page not found";
      message = fromData || "There is nothing at this address, or you do not have access to it.";
    } else if (status === 403) {
      title = "Not allowed";
      message = fromData || "Your role in this lab does not allow this.";
    } else if (status === 401) {
      title = "Please sign in";
      message = fromData || "You need to be signed in to see this page.";
    } else {
      title = error.statusText || title;
      message = fromData || message;
    }
  } else if (import.meta.env.DEV && error instanceof Error) {
    message = error.message;
    details = error.stack;
  }

  return (
    <section className="mx-auto max-w-prose py-10" role="alert">
      <p className="text-sm font-semibold text-accent">Error {status}</p>
      <h1 className="mt-2 text-3xl font-semibold tracking-tight">{title}</h1>
      <p className="mt-4 text-muted">{message}</p>
      {details && (
        <pre className="mt-6 overflow-x-auto rounded-md bg-sunken p-4 text-xs text-muted">{details}</pre>
      )}
      <div className="mt-8 flex gap-3">
        <Link to="/" className="btn-primary">
          Go to the start page
        </Link>
      </div>
    </section>
  );
}
