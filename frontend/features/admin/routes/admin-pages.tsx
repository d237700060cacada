import { ConfirmButton } from '../../../components/confirm-button';
import { DataTable } from '../../../components/data-table';
import { ProblemMessage } from '../../../components/problem-message';
import { useAdminMutations, useAllKeys, useAudit, useOutbox, useUsers } from '../api/admin';

const when = (iso: string | null) => (iso ? new Date(iso).toLocaleString() : '—');
const td = 'px-3 py-1.5 align-top';

export function UsersPage() {
  const users = useUsers();
  const { updateUser } = useAdminMutations();
  return (
    <>
      {users.isError ? <ProblemMessage error={users.error} /> : null}
      {updateUser.isError ? <ProblemMessage error={updateUser.error} /> : null}
      <DataTable
        caption="People with an account"
        headers={[
          'Name',
          'E-mail',
          'Role',
          'Confirmed',
          'State',
          { label: 'Actions', visuallyHidden: true },
        ]}
        minWidth="40rem"
      >
        {users.data?.items.map((u) => (
          <tr key={u.id} className="border-t border-patina-50">
            <td className={td}>{u.name}</td>
            <td className={td}>{u.email}</td>
            <td className={td}>
              <select
                aria-label={`Role of ${u.email}`}
                className="rounded border border-patina-300 px-1 py-0.5"
                value={u.role}
                onChange={(e) =>
                  updateUser.mutate({ id: u.id, role: e.target.value as typeof u.role })
                }
              >
                {['reader', 'integrator', 'curator', 'admin'].map((r) => (
                  <option key={r}>{r}</option>
                ))}
              </select>
            </td>
            <td className={td}>{u.emailVerified ? 'yes' : 'no'}</td>
            <td className={td}>{u.status}</td>
            <td className={td}>
              {u.status === 'active' ? (
                <ConfirmButton
                  className="text-copper-700 underline"
                  title={`Disable ${u.name} (${u.email})?`}
                  description={
                    <p>
                      Their sessions end at once and they cannot sign in until an admin enables them
                      again. Their API keys are refused while the account is disabled.
                    </p>
                  }
                  confirmLabel="Disable the account"
                  onConfirm={() => updateUser.mutate({ id: u.id, status: 'disabled' })}
                >
                  Disable <span className="sr-only">{u.email}</span>
                </ConfirmButton>
              ) : (
                <button
                  type="button"
                  className="underline"
                  onClick={() => updateUser.mutate({ id: u.id, status: 'active' })}
                >
                  Enable <span className="sr-only">{u.email}</span>
                </button>
              )}
            </td>
          </tr>
        ))}
      </DataTable>
    </>
  );
}

export function KeysPage() {
  const keys = useAllKeys();
  const { revokeKey } = useAdminMutations();
  return (
    <>
      {keys.isError ? <ProblemMessage error={keys.error} /> : null}
      {revokeKey.isError ? <ProblemMessage error={revokeKey.error} title="Not revoked" /> : null}
      <DataTable
        caption="Every API key"
        headers={[
          'Owner',
          'Name',
          'Prefix',
          'Role',
          'Last used',
          'Expires',
          'Revoked',
          { label: 'Actions', visuallyHidden: true },
        ]}
        minWidth="44rem"
      >
        {keys.data?.items.map((k) => (
          <tr key={k.id} className="border-t border-patina-50">
            <td className={td}>#{k.ownerId}</td>
            <td className={td}>{k.name}</td>
            <td className={`${td} font-mono text-xs`}>cdy_{k.prefix}_…</td>
            <td className={td}>{k.role}</td>
            <td className={td}>{when(k.lastUsedAt)}</td>
            <td className={td}>{when(k.expiresAt)}</td>
            <td className={td}>{when(k.revokedAt)}</td>
            <td className={td}>
              {k.revokedAt ? null : (
                <ConfirmButton
                  className="text-copper-700 underline"
                  title={`Revoke the key “${k.name}” of owner #${k.ownerId}?`}
                  description={
                    <p>
                      Every tool that sends it is refused from now on; this cannot be undone. Its
                      owner can make a new one on Access.
                    </p>
                  }
                  confirmLabel="Revoke the key"
                  onConfirm={() => revokeKey.mutate(k.id)}
                >
                  Revoke <span className="sr-only">{k.name}</span>
                </ConfirmButton>
              )}
            </td>
          </tr>
        ))}
      </DataTable>
    </>
  );
}

export function AuditPage() {
  const audit = useAudit();
  return (
    <>
      {audit.isError ? <ProblemMessage error={audit.error} /> : null}
      <DataTable
        caption="Audit log, newest first"
        headers={['When', 'Who', 'What', 'On', 'Detail', 'From']}
        minWidth="44rem"
      >
        {audit.data?.items.map((a) => (
          <tr key={a.id} className="border-t border-patina-50">
            <td className={td}>{when(a.at)}</td>
            <td className={td}>{a.actor ?? '—'}</td>
            <td className={td}>{a.action}</td>
            <td className={td}>{a.target ?? '—'}</td>
            <td className={`${td} font-mono text-xs`}>
              {a.detail ? JSON.stringify(a.detail) : ''}
            </td>
            <td className={td}>{a.address ?? ''}</td>
          </tr>
        ))}
      </DataTable>
    </>
  );
}

export function OutboxPage() {
  const outbox = useOutbox();
  return (
    <div className="flex flex-col gap-3">
      <p className="text-sm text-ink/70">
        Every message the service sent; in development they go to a local fake mail server and stop
        here. Sign-up and reset links are masked: they belong to the person they were sent to. In
        development the server&rsquo;s terminal prints each link for the developer who runs it.
      </p>
      {outbox.isError ? <ProblemMessage error={outbox.error} /> : null}
      {outbox.data?.items.length === 0 ? <p>No mail yet.</p> : null}
      <ol aria-label="Messages, newest first" className="flex flex-col gap-2">
        {outbox.data?.items.map((m) => (
          <li key={m.id} className="rounded-md border border-patina-100 bg-white p-3 text-sm">
            <p className="font-semibold">{m.subject}</p>
            <p className="text-xs text-ink/60">
              to {m.to} · {when(m.at)} · {m.template}
            </p>
            <pre className="mt-2 whitespace-pre-wrap font-sans">{m.text}</pre>
          </li>
        ))}
      </ol>
    </div>
  );
}
