import { Link, Outlet, useLocation } from 'react-router-dom';
import { signInPath, useMe, type Me } from '../lib/session';

type Role = Me['role'];

const roleNames: Record<Role, string> = {
  reader: 'readers',
  integrator: 'integrators',
  curator: 'curators',
  admin: 'admins',
};

const capital = (s: string) => `${s[0]?.toUpperCase() ?? ''}${s.slice(1)}`;

/** 'curators and admins', 'anyone with an account'. */
function whoMay(roles: readonly Role[]): string {
  if (roles.length === 4) return 'anyone with an account';
  const names = roles.map((r) => roleNames[r]);
  return names.length === 1 ? names[0]! : `${names.slice(0, -1).join(', ')} and ${names.at(-1)}`;
}

/**
 * The page a person sees instead of a screen their role may not open: who may, and the way in
 * (signing in, coming back here afterwards) or the way round (an admin gives roles). The API
 * refuses them whatever this page shows; this only says so in words.
 */
export function RefusedPage({ screen, roles }: { screen: string; roles: readonly Role[] }) {
  const me = useMe();
  const location = useLocation();
  const here = `${location.pathname}${location.search}`;
  const signedIn = me.data ?? null;
  return (
    <section aria-labelledby="refused-title" className="flex max-w-2xl flex-col gap-3">
      <h1 id="refused-title" className="text-2xl font-semibold tracking-tight">
        {signedIn ? `${capital(screen)} is not open to your role` : `Sign in to open ${screen}`}
      </h1>
      <p>
        {capital(screen)} is for {whoMay(roles)}.{' '}
        {signedIn
          ? `You are signed in as ${signedIn.email}, with the role ${signedIn.role}. An admin can change a person's role under Administration.`
          : 'Sign in with your account and you come straight back here.'}
      </p>
      <p className="flex flex-wrap items-center gap-4">
        <Link
          to={signInPath(here)}
          className="rounded bg-patina-700 px-4 py-2 font-medium text-white no-underline hover:bg-patina-900"
        >
          {signedIn ? 'Sign in as someone else' : 'Sign in'}
        </Link>
        {signedIn ? null : (
          <Link to="/sign-up" className="text-patina-700 underline">
            Create an account
          </Link>
        )}
        <Link to="/" className="text-patina-700 underline">
          Back to the Catalogue
        </Link>
      </p>
      {signedIn || roles.includes('reader') ? null : (
        <p className="text-sm text-ink/70">
          A new account is a reader&apos;s; curators and admins are named by an admin.
        </p>
      )}
    </section>
  );
}

/**
 * A route element that shows its child screens only to the given roles, and the refused page to
 * everyone else (visitors included); while it is not yet known who is signed in, it waits.
 */
export function RequireRole({ screen, roles }: { screen: string; roles: readonly Role[] }) {
  const me = useMe();
  if (me.isPending) return <p role="status">Checking who is signed in…</p>;
  if (!me.data || !roles.includes(me.data.role))
    return <RefusedPage screen={screen} roles={roles} />;
  return <Outlet />;
}
