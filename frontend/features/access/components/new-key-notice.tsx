import { useState } from 'react';
import type { NewKey } from '../api/keys';

/** The key itself, shown this once, with a copy button. */
export function NewKeyNotice({ created, onDone }: { created: NewKey; onDone: () => void }) {
  const [copied, setCopied] = useState(false);
  return (
    <div
      role="alert"
      className="flex flex-col gap-2 rounded-md border-2 border-patina-700 bg-patina-50 p-4 text-sm"
    >
      <p className="font-semibold">
        Copy the key “{created.name}” now: it is shown this once and never again.
      </p>
      <div className="flex flex-wrap items-center gap-2">
        <code
          aria-label="The new API key"
          className="break-all rounded bg-white px-2 py-1 font-mono text-xs"
        >
          {created.key}
        </code>
        <button
          type="button"
          className="rounded border border-patina-700 px-2 py-1"
          onClick={() =>
            void navigator.clipboard?.writeText(created.key).then(() => setCopied(true))
          }
        >
          {copied ? 'Copied' : 'Copy'}
        </button>
      </div>
      {created.previousKeyExpiresAt ? (
        <p>
          The key it replaces keeps working until{' '}
          {new Date(created.previousKeyExpiresAt).toLocaleString()}.
        </p>
      ) : null}
      <p>
        Send it as{' '}
        <code>Authorization: Bearer {created.prefix ? `cdy_${created.prefix}_…` : 'cdy_…'}</code>.
        Keys are for tools and scripts, never for signing in here.
      </p>
      <button type="button" className="self-start underline" onClick={onDone}>
        I have stored it
      </button>
    </div>
  );
}
