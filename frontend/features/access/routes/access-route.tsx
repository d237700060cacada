import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { ConfirmButton } from '../../../components/confirm-button';
import { DataTable } from '../../../components/data-table';
import { ProblemMessage } from '../../../components/problem-message';
import { setFieldErrors, type FormFieldMap } from '../../../lib/field-errors';
import { useMe } from '../../../lib/session';
import { useKeyMutations, useMyKeys, useUsage, type NewKey } from '../api/keys';
import { submitClass, TextField } from '../components/auth-form';
import { NewKeyNotice } from '../components/new-key-notice';
import { UsageChart } from '../components/usage-chart';
import { newKeySchema } from '../schemas';

const ranks = ['reader', 'integrator', 'curator', 'admin'] as const;
type Values = z.infer<typeof newKeySchema>;
/** Request fields the form shows itself (a refused role is named in the message below it). */
const fields: FormFieldMap<Values> = {
  name: { name: 'name', label: 'Name' },
  expiresAt: { name: 'expiresInDays', label: 'Expires in (days)' },
};
/** An expiry this many days from now, computed when the form is sent. */
function expiryIn(days: string): { expiresAt?: string } {
  return days ? { expiresAt: new Date(Date.now() + Number(days) * 86_400_000).toISOString() } : {};
}

const when = (iso: string | null) => (iso ? new Date(iso).toLocaleString() : '—');

function keyState(k: { revokedAt: string | null; expiresAt: string | null }) {
  if (k.revokedAt) return 'revoked';
  if (k.expiresAt && Date.parse(k.expiresAt) <= Date.now()) return 'expired';
  return 'live';
}

export function AccessRoute() {
  const me = useMe();
  const keys = useMyKeys();
  const usage = useUsage();
  const { create, revoke, rotate } = useKeyMutations();
  const [shown, setShown] = useState<NewKey | null>(null);
  const { register, handleSubmit, reset, formState, setError } = useForm<Values>({
    resolver: zodResolver(newKeySchema),
    defaultValues: { name: '', role: 'reader', expiresInDays: '90' },
  });
  // The router shows visitors the refused page (app/require-role.tsx); this waits for the answer.
  if (!me.data) return <p role="status">Loading…</p>;
  const allowed = ranks.slice(0, ranks.indexOf(me.data.role) + 1);

  return (
    <section aria-labelledby="access-title" className="flex flex-col gap-5">
      <header>
        <h1 id="access-title" className="text-2xl font-semibold tracking-tight">
          Access
        </h1>
        <p className="text-sm text-ink/70">
          Signed in as {me.data.name} ({me.data.email}), role {me.data.role}. API keys let your
          tools call the API; each key acts with the role you give it, never above your own.
        </p>
      </header>

      {shown ? <NewKeyNotice created={shown} onDone={() => setShown(null)} /> : null}

      <form
        noValidate
        aria-labelledby="new-key-title"
        className="flex flex-wrap items-end gap-3 rounded-md border border-patina-100 bg-white p-4"
        onSubmit={handleSubmit((v) =>
          create.mutate(
            {
              name: v.name,
              role: v.role,
              ...expiryIn(v.expiresInDays),
            },
            {
              onSuccess: (k) => (setShown(k), reset()),
              onError: (e) => setFieldErrors(e, setError, fields),
            },
          ),
        )}
      >
        <h2 id="new-key-title" className="w-full text-lg font-semibold">
          New API key
        </h2>
        <TextField
          id="key-name"
          label="Name"
          error={formState.errors.name}
          registration={register('name')}
        />
        <label className="flex flex-col gap-1 text-sm">
          <span className="font-medium">Role</span>
          <select className="rounded border border-patina-300 px-2 py-1.5" {...register('role')}>
            {allowed.map((r) => (
              <option key={r} value={r}>
                {r}
              </option>
            ))}
          </select>
        </label>
        <TextField
          id="key-days"
          label="Expires in (days)"
          error={formState.errors.expiresInDays}
          registration={register('expiresInDays')}
        />
        <button type="submit" className={submitClass} disabled={create.isPending}>
          Create the key
        </button>
        {create.isError ? (
          <ProblemMessage error={create.error} title="No key created" fields={fields} />
        ) : null}
      </form>

      <section aria-labelledby="keys-title" className="flex flex-col gap-2">
        <h2 id="keys-title" className="text-lg font-semibold">
          Your keys
        </h2>
        {keys.isError ? <ProblemMessage error={keys.error} /> : null}
        <DataTable
          caption="Your API keys"
          headers={[
            'Name',
            'Prefix',
            'Role',
            'Created',
            'Last used',
            'Expires',
            'State',
            { label: 'Actions', visuallyHidden: true },
          ]}
          minWidth="44rem"
        >
          {keys.data?.items.length === 0 ? (
            <tr>
              <td colSpan={8} className="px-3 py-3 text-ink/70">
                No keys yet.
              </td>
            </tr>
          ) : null}
          {keys.data?.items.map((k) => (
            <tr key={k.id} className="border-t border-patina-50">
              <td className="px-3 py-1.5 font-medium">{k.name}</td>
              <td className="px-3 py-1.5 font-mono text-xs">cdy_{k.prefix}_…</td>
              <td className="px-3 py-1.5">{k.role}</td>
              <td className="px-3 py-1.5">{when(k.createdAt)}</td>
              <td className="px-3 py-1.5">{when(k.lastUsedAt)}</td>
              <td className="px-3 py-1.5">{when(k.expiresAt)}</td>
              <td className="px-3 py-1.5">{keyState(k)}</td>
              <td className="px-3 py-1.5">
                {keyState(k) === 'live' ? (
                  <span className="flex flex-wrap gap-3">
                    <button
                      type="button"
                      className="underline"
                      onClick={() => rotate.mutate(k.id, { onSuccess: setShown })}
                    >
                      Rotate <span className="sr-only">{k.name}</span>
                    </button>
                    <ConfirmButton
                      className="text-copper-700 underline"
                      title={`Revoke the key “${k.name}”?`}
                      description={
                        <p>
                          Every tool that sends it is refused from now on; this cannot be undone. To
                          replace a key without a gap, rotate it instead.
                        </p>
                      }
                      confirmLabel="Revoke the key"
                      onConfirm={() => revoke.mutate(k.id)}
                    >
                      Revoke <span className="sr-only">{k.name}</span>
                    </ConfirmButton>
                  </span>
                ) : null}
              </td>
            </tr>
          ))}
        </DataTable>
        {revoke.isError ? <ProblemMessage error={revoke.error} title="Not revoked" /> : null}
        {rotate.isError ? <ProblemMessage error={rotate.error} title="Not rotated" /> : null}
      </section>

      {usage.data ? <UsageChart rows={usage.data.items} from={usage.data.from} /> : null}
    </section>
  );
}
