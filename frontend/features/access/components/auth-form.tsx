import type { ReactNode } from 'react';

/** The frame the sign-in, sign-up and reset forms share. */
export function AuthFrame({
  title,
  children,
  footer,
}: {
  title: string;
  children: ReactNode;
  footer?: ReactNode;
}) {
  return (
    <section aria-labelledby="auth-title" className="mx-auto flex w-full max-w-md flex-col gap-4">
      <h1 id="auth-title" className="text-2xl font-semibold tracking-tight">
        {title}
      </h1>
      <div className="rounded-md border border-patina-100 bg-white p-4">{children}</div>
      {footer ? <div className="text-sm">{footer}</div> : null}
    </section>
  );
}

export function TextField({
  id,
  label,
  type = 'text',
  error,
  autoComplete,
  registration,
}: {
  id: string;
  label: string;
  type?: string;
  error?: { message?: string };
  autoComplete?: string;
  registration: Record<string, unknown>;
}) {
  return (
    <div className="flex flex-col gap-1 text-sm">
      <label htmlFor={id} className="font-medium">
        {label}
      </label>
      <input
        id={id}
        type={type}
        autoComplete={autoComplete}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-msg` : undefined}
        className="rounded border border-patina-300 px-2 py-1.5 aria-[invalid=true]:border-copper-500 aria-[invalid=true]:bg-copper-100"
        {...registration}
      />
      {error ? (
        <p id={`${id}-msg`} className="text-xs text-copper-700">
          {error.message}
        </p>
      ) : null}
    </div>
  );
}

export const submitClass =
  'rounded bg-copper-500 px-4 py-2 font-medium text-white hover:bg-copper-700 disabled:opacity-50';
