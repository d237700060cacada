import { NavLink, Outlet } from 'react-router-dom';

const tab = ({ isActive }: { isActive: boolean }) =>
  `rounded px-3 py-1 text-sm ${isActive ? 'bg-patina-700 text-white' : 'hover:bg-patina-50'}`;

/**
 * The operator's pages. The router shows everyone but admins the refused page
 * (app/require-role.tsx); the API refuses them whatever this page shows.
 */
export function AdminRoute() {
  return (
    <section aria-labelledby="admin-title" className="flex flex-col gap-4">
      <h1 id="admin-title" className="text-2xl font-semibold tracking-tight">
        Administration
      </h1>
      <nav aria-label="Administration" className="flex flex-wrap gap-1">
        <NavLink to="/admin/users" className={tab}>
          People
        </NavLink>
        <NavLink to="/admin/keys" className={tab}>
          All keys
        </NavLink>
        <NavLink to="/admin/audit" className={tab}>
          Audit log
        </NavLink>
        <NavLink to="/admin/outbox" className={tab}>
          Outbox
        </NavLink>
      </nav>
      <Outlet />
    </section>
  );
}
