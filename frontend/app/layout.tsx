import { useId, useRef, useState, type KeyboardEvent, type MouseEvent } from 'react';
import { NavLink, Outlet, useLocation, useNavigate, useNavigation } from 'react-router-dom';
import { signInPath, useMe, useSignOut } from '../lib/session';

const linkClass = ({ isActive }: { isActive: boolean }) =>
  `rounded px-3 py-1.5 text-sm font-medium ${isActive ? 'bg-paper text-patina-900' : 'text-patina-50 hover:bg-patina-700'}`;

/** Our mark: a coil's field lines closing through a blank, drawn in two strokes. */
function Mark() {
  return (
    <svg aria-hidden="true" viewBox="0 0 32 32" className="h-7 w-7">
      <rect x="4" y="20" width="24" height="5" rx="1.5" fill="#e3a677" />
      <path
        d="M8 18c0-6 4-10 8-10s8 4 8 10"
        fill="none"
        stroke="#f7f5f0"
        strokeWidth="2.2"
        strokeLinecap="round"
      />
      <path
        d="M12 18c0-3 2-5 4-5s4 2 4 5"
        fill="none"
        stroke="#f7f5f0"
        strokeWidth="2.2"
        strokeLinecap="round"
      />
    </svg>
  );
}

/** Who is signed in, with their pages; or the way in (coming back to this page afterwards). */
function AccountArea() {
  const me = useMe();
  const signOut = useSignOut();
  const navigate = useNavigate();
  const location = useLocation();
  if (!me.data) {
    return (
      <NavLink to={signInPath(`${location.pathname}${location.search}`)} className={linkClass}>
        Sign in
      </NavLink>
    );
  }
  return (
    <div className="flex flex-col gap-1 lg:flex-row lg:flex-wrap lg:items-center">
      <p className="px-3 text-xs text-patina-100 lg:hidden">
        Signed in as {me.data.email} ({me.data.role})
      </p>
      {me.data.role === 'curator' || me.data.role === 'admin' ? (
        <NavLink to="/review" className={linkClass}>
          Review Desk
        </NavLink>
      ) : null}
      <NavLink to="/access" className={linkClass}>
        Access
      </NavLink>
      {me.data.role === 'admin' ? (
        <NavLink to="/admin" className={linkClass}>
          Administration
        </NavLink>
      ) : null}
      <button
        type="button"
        className="rounded px-3 py-1.5 text-left text-sm text-patina-50 hover:bg-patina-700"
        title={`${me.data.email} (${me.data.role})`}
        onClick={() => signOut.mutate(undefined, { onSettled: () => navigate('/') })}
      >
        Sign out <span className="sr-only">{me.data.email}</span>
      </button>
    </div>
  );
}

/** Three bars that become a cross while the menu is open. */
function MenuIcon({ open }: { open: boolean }) {
  return (
    <svg aria-hidden="true" viewBox="0 0 20 20" className="h-5 w-5">
      {open ? (
        <path d="M5 5l10 10M15 5L5 15" stroke="currentColor" strokeWidth="2" />
      ) : (
        <path d="M3 5h14M3 10h14M3 15h14" stroke="currentColor" strokeWidth="2" />
      )}
    </svg>
  );
}

export function Layout() {
  const navigation = useNavigation();
  // Below 1024 px the navigation folds behind one button, so the header keeps to one row.
  const [menuOpen, setMenuOpen] = useState(false);
  const menuButton = useRef<HTMLButtonElement>(null);
  const menuId = useId();
  const closeOnLink = (e: MouseEvent) => {
    if ((e.target as HTMLElement).closest('a, button')) setMenuOpen(false);
  };
  const closeOnEscape = (e: KeyboardEvent) => {
    if (e.key === 'Escape' && menuOpen) {
      setMenuOpen(false);
      menuButton.current?.focus();
    }
  };
  return (
    <div className="flex min-h-screen flex-col">
      <a
        href="#main"
        className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:bg-white focus:p-2"
      >
        Skip to content
      </a>
      <header className="bg-patina-900 text-white">
        <div className="mx-auto flex max-w-6xl flex-wrap items-center justify-between gap-x-3 gap-y-1 px-4 py-2.5 lg:flex-nowrap">
          <NavLink to="/" className="flex items-center gap-2 text-lg font-semibold tracking-tight">
            <Mark />
            Conductory
          </NavLink>
          <button
            ref={menuButton}
            type="button"
            className="flex items-center gap-1.5 rounded px-3 py-1.5 text-sm font-medium text-patina-50 hover:bg-patina-700 lg:hidden"
            aria-expanded={menuOpen}
            aria-controls={menuId}
            onClick={() => setMenuOpen((open) => !open)}
          >
            <MenuIcon open={menuOpen} />
            Menu
          </button>
          <div
            id={menuId}
            className={`${menuOpen ? 'flex' : 'hidden'} w-full flex-col gap-2 border-t border-patina-700 pt-2 pb-1 lg:flex lg:w-auto lg:flex-1 lg:flex-row lg:items-center lg:justify-between lg:border-0 lg:p-0`}
            onClick={closeOnLink}
            onKeyDown={closeOnEscape}
          >
            <nav aria-label="Main" className="flex flex-col gap-1 lg:flex-row lg:flex-wrap">
              <NavLink to="/" end className={linkClass}>
                Catalogue
              </NavLink>
              <NavLink to="/match" className={linkClass}>
                Match
              </NavLink>
              <NavLink to="/layer-lab" className={linkClass}>
                Layer Lab
              </NavLink>
              <NavLink to="/pulse-bench" className={linkClass}>
                Pulse Bench
              </NavLink>
              <NavLink to="/sort-planner" className={linkClass}>
                Sort Planner
              </NavLink>
              <a
                href="/api/docs/"
                className="rounded px-3 py-1.5 text-sm font-medium text-patina-50 hover:bg-patina-700"
              >
                API reference
              </a>
            </nav>
            <AccountArea />
          </div>
        </div>
        <div
          role="progressbar"
          aria-label="Loading"
          aria-hidden={navigation.state === 'idle'}
          className={`h-0.5 bg-copper-300 transition-opacity ${navigation.state === 'idle' ? 'opacity-0' : 'animate-pulse opacity-100'}`}
        />
      </header>
      <main id="main" className="mx-auto w-full max-w-6xl flex-1 px-4 py-6">
        <Outlet />
      </main>
      <footer className="border-t border-patina-100 text-xs text-ink/70">
        <div className="mx-auto flex max-w-6xl flex-wrap justify-between gap-x-4 gap-y-1 px-4 py-3">
          <p>
            Conductory: conductivity and density of metals and alloys, every value with its source.
            Values at 20 °C unless stated.
          </p>
          <NavLink to="/checks" className="text-patina-700 underline underline-offset-2">
            How we check the engine and the table
          </NavLink>
        </div>
      </footer>
    </div>
  );
}
