import { Links, Meta, Outlet, Scripts, ScrollRestoration, useRouteLoaderData } from "react-router";
import type { Route } from "./+types/root";
import { AppShell } from "./components/app-shell";
import { ErrorView } from "./components/error-view";
import { getShellUser } from "./shell-user.server";
import "./app.css";

export async function loader({ request }: Route.LoaderArgs) {
  return { user: await getShellUser(request) };
}

export const links: Route.LinksFunction = () => [{ rel: "icon", href: "/favicon.svg", type: "image/svg+xml" }];

export const meta: Route.MetaFunction = () => [
  { title: "Stillpoint — steady states of reaction networks" },
  {
    name: "description",
    content:
      "Stillpoint analyses mass-action reaction networks: structure, conservation laws, deficiency, exact Gröbner bases and steady states.",
  },
];

export function Layout({ children }: { children: React.ReactNode }) {
  return (
    <html lang="en">
      <head>
        <meta charSet="utf-8" />
        <meta name="viewport" content="width=device-width, initial-scale=1" />
        <Meta />
        <Links />
      </head>
      <body className="min-h-screen bg-paper font-sans text-ink">
        {children}
        <ScrollRestoration />
        <Scripts />
      </body>
    </html>
  );
}

export default function App({ loaderData }: Route.ComponentProps) {
  return (
    <AppShell user={loaderData.user}>
      <Outlet />
    </AppShell>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  // The root loader may be the thing that failed, so its data is optional here.
  const data = useRouteLoaderData<typeof loader>("root");
  return (
    <AppShell user={data?.user ?? null}>
      <ErrorView error={error} />
    </AppShell>
  );
}
