import { Link, data, useLocation } from "react-router";
import type { Route } from "./+types/not-found";

/** Any URL no other route claims: a real 404 status with a helpful page. */
export function loader() {
  return data(null, { status: 404 });
}

export const meta: Route.MetaFunction = () => [{ title: "Page not found · Stillpoint" }];

export default function NotFound() {
  const { pathname } = useLocation();
  return (
    <section className="mx-auto max-w-prose py-10">
      <p className="text-sm font-semibold text-accent">Error 404</p>
      <h1 className="mt-2 text-3xl font-semibold tracking-tight">Page not found</h1>
      <p className="mt-4 text-muted">
        Nothing lives at <code className="rounded-sm bg-sunken px-1.5 py-0.5 text-sm text-ink">{pathname}</code>. The
        address may be mistyped, or the page may belong to a lab you are not a member of.
      </p>
      <div className="mt-8 flex gap-3">
        <Link to="/" className="btn-primary">
          Go to the start page
        </Link>
        <Link to="/networks" className="btn-quiet">
          Browse networks
        </Link>
      </div>
    </section>
  );
}
