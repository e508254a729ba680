import { Form, Link, NavLink, useLocation } from "react-router";
import type { ShellUser } from "~/shell-user.server";

/** Top-level sections; each links to its own route module. */
export const NAV_ITEMS = [
  { to: "/networks", label: "Networks" },
  { to: "/analyses", label: "Analyses" },
  { to: "/labs", label: "Labs" },
] as const;

export function AppShell({ user, children }: { user: ShellUser | null; children: React.ReactNode }) {
  const { pathname } = useLocation();
  return (
    <div className="flex min-h-screen flex-col">
      <header className="border-b border-line bg-surface">
        {/* On a phone the menu wraps to a row of its own below the name and the person's menu. */}
        <div className="mx-auto flex max-w-page flex-wrap items-center gap-x-8 gap-y-2 px-4 py-3 sm:px-6">
          <Link to="/" className="flex items-center gap-2 text-lg font-semibold tracking-tight text-ink">
            <StillpointMark />
            Stillpoint
          </Link>
          <nav aria-label="Main" className="order-last -mx-1 flex w-full gap-1 overflow-x-auto text-sm sm:order-none sm:mx-0 sm:w-auto">
            {NAV_ITEMS.map((item) => (
              <NavLink
                key={item.to}
                to={item.to}
                className={({ isActive }) =>
                  `rounded-md px-3 py-1.5 ${navActive(item.to, isActive, pathname) ? "bg-accent-soft text-accent-strong" : "text-muted hover:bg-sunken hover:text-ink"}`
                }
              >
                {item.label}
              </NavLink>
            ))}
          </nav>
          <div className="ml-auto min-w-0 text-sm" data-testid="session-state">
            {user ? (
              <div className="flex min-w-0 items-center gap-4">
                {user.activeLab && (
                  <Link to={`/labs/${user.activeLab.slug}`} className="hidden max-w-48 truncate text-muted hover:text-ink sm:inline" data-testid="active-lab" title="Working lab (switch under Labs)">
                    {user.activeLab.name}
                  </Link>
                )}
                <UserMenu user={user} />
              </div>
            ) : (
              <Link to="/sign-in" className="btn-quiet py-1.5">
                Sign in
              </Link>
            )}
          </div>
        </div>
      </header>
      <main className="mx-auto w-full min-w-0 max-w-page flex-1 px-4 py-6 sm:px-6 sm:py-10">{children}</main>
      <footer className="border-t border-line">
        <div className="mx-auto max-w-page px-4 py-4 text-xs text-faint sm:px-6">
          Stillpoint · exact analysis of mass-action reaction networks
        </div>
      </footer>
    </div>
  );
}

/**
 * The signed-in person's menu: account (API tokens, sessions) and sign-out, from every page. A
 * native <details> so it opens without JavaScript; sign-out is a POST, never a link.
 */
function UserMenu({ user }: { user: ShellUser }) {
  return (
    <details className="group relative" data-testid="user-menu">
      <summary className="flex cursor-pointer list-none items-center gap-2 text-muted hover:text-ink [&::-webkit-details-marker]:hidden" title={user.displayName}>
        <span className="grid size-7 place-items-center rounded-pill bg-accent-soft text-xs font-semibold text-accent-strong">{initials(user.displayName)}</span>
        <span className="hidden max-w-40 truncate sm:inline">{user.displayName}</span>
        <span aria-hidden className="text-faint group-open:rotate-180">▾</span>
      </summary>
      <div className="absolute right-0 z-20 mt-2 w-52 rounded-card border border-line bg-surface p-1 shadow-lg" role="menu">
        <Link to="/account" role="menuitem" className="block rounded-md px-3 py-2 text-ink hover:bg-sunken">
          Account and API tokens
        </Link>
        <Form method="post" action="/sign-out">
          <button type="submit" role="menuitem" className="block w-full rounded-md px-3 py-2 text-left text-ink hover:bg-sunken">
            Sign out
          </button>
        </Form>
      </div>
    </details>
  );
}

/**
 * Lab network and analysis pages live under /labs/:slug/… but belong to "Networks" and "Analyses"
 * in the menu (starting an analysis, /labs/:slug/networks/:id/analyse, counts as "Analyses").
 */
export function navActive(to: string, isActive: boolean, pathname: string): boolean {
  const onAnalysisPage = /^\/labs\/[^/]+\/(analyses(\/|$)|networks\/[^/]+\/analyse$)/.test(pathname);
  const onNetworkPage = !onAnalysisPage && /^\/labs\/[^/]+\/networks(\/|$)/.test(pathname);
  if (to === "/networks") return isActive || onNetworkPage;
  if (to === "/analyses") return isActive || onAnalysisPage;
  if (to === "/labs") return isActive && !onNetworkPage && !onAnalysisPage;
  return isActive;
}

function initials(name: string) {
  return name
    .split(/\s+/)
    .filter(Boolean)
    .slice(0, 2)
    .map((part) => part[0]!.toUpperCase())
    .join("");
}

/** Two arrows meeting at a dot: forward and backward fluxes balancing at a steady state. */
function StillpointMark() {
  return (
    <svg viewBox="0 0 24 24" className="size-6" aria-hidden="true">
      <circle cx="12" cy="12" r="10.5" fill="none" stroke="var(--color-accent)" strokeWidth="1.5" />
      <path d="M4.5 9.5h6" stroke="var(--color-accent)" strokeWidth="1.5" strokeLinecap="round" />
      <path d="M8.5 7.5l2 2-2 2" fill="none" stroke="var(--color-accent)" strokeWidth="1.5" strokeLinecap="round" />
      <path d="M19.5 14.5h-6" stroke="var(--color-ink)" strokeWidth="1.5" strokeLinecap="round" />
      <path d="M15.5 12.5l-2 2 2 2" fill="none" stroke="var(--color-ink)" strokeWidth="1.5" strokeLinecap="round" />
      <circle cx="12" cy="12" r="1.6" fill="var(--color-accent-strong)" />
    </svg>
  );
}
