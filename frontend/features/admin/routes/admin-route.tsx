import { NavLink, Navigate, Outlet } from 'react-router-dom';
import { useMe } from '../../../lib/session';

const tab = ({ isActive }: { isActive: boolean }) =>
  `rounded px-3 py-1 text-sm ${isActive ? 'bg-patina-700 text-white' : 'hover:bg-patina-50'}`;

/** The operator's pages; the API refuses everyone else whatever this page shows. */
export function AdminRoute() {
  const me = useMe();
  if (me.data === null) return <Navigate to="/sign-in" replace />;
  if (me.data && me.data.role !== 'admin') return <p role="alert">These pages are for admins.</p>;
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
