import { zodResolver } from '@hookform/resolvers/zod';
import { useMutation } from '@tanstack/react-query';
import { useForm } from 'react-hook-form';
import { Link, useSearchParams } from 'react-router-dom';
import type { z } from 'zod';
import { ProblemMessage } from '../../../components/problem-message';
import { setFieldErrors, type FormFieldMap } from '../../../lib/field-errors';
import { requestReset, resetPassword } from '../api/auth';
import { AuthFrame, submitClass, TextField } from '../components/auth-form';
import { resetRequestSchema, resetSchema } from '../schemas';

const requestFields: FormFieldMap<z.infer<typeof resetRequestSchema>> = {
  email: { name: 'email', label: 'E-mail' },
};
const resetFields: FormFieldMap<z.infer<typeof resetSchema>> = {
  password: { name: 'password', label: 'New password' },
};

function RequestForm() {
  const mutation = useMutation({ mutationFn: (v: { email: string }) => requestReset(v.email) });
  const { register, handleSubmit, formState, setError } = useForm<
    z.infer<typeof resetRequestSchema>
  >({
    resolver: zodResolver(resetRequestSchema),
  });
  if (mutation.isSuccess) return <p role="status">{mutation.data.detail}</p>;
  return (
    <form
      noValidate
      className="flex flex-col gap-3"
      onSubmit={handleSubmit((v) =>
        mutation.mutate(v, { onError: (e) => setFieldErrors(e, setError, requestFields) }),
      )}
    >
      <TextField
        id="email"
        label="E-mail"
        type="email"
        autoComplete="username"
        error={formState.errors.email}
        registration={register('email')}
      />
      {mutation.isError ? (
        <ProblemMessage error={mutation.error} title="No link sent" fields={requestFields} />
      ) : null}
      <button type="submit" className={submitClass} disabled={mutation.isPending}>
        Mail me a reset link
      </button>
    </form>
  );
}

function NewPasswordForm({ token }: { token: string }) {
  const mutation = useMutation({
    mutationFn: (v: { password: string }) => resetPassword(token, v.password),
  });
  const { register, handleSubmit, formState, setError } = useForm<z.infer<typeof resetSchema>>({
    resolver: zodResolver(resetSchema),
  });
  if (mutation.isSuccess) {
    return (
      <p role="status">
        The password is changed and every session signed out.{' '}
        <Link className="text-patina-700 underline" to="/sign-in">
          Sign in
        </Link>
      </p>
    );
  }
  return (
    <form
      noValidate
      className="flex flex-col gap-3"
      onSubmit={handleSubmit((v) =>
        mutation.mutate(v, { onError: (e) => setFieldErrors(e, setError, resetFields) }),
      )}
    >
      <TextField
        id="password"
        label="New password (8 to 64 characters)"
        type="password"
        autoComplete="new-password"
        error={formState.errors.password}
        registration={register('password')}
      />
      {mutation.isError ? (
        <ProblemMessage error={mutation.error} title="Not changed" fields={resetFields} />
      ) : null}
      <button type="submit" className={submitClass} disabled={mutation.isPending}>
        Set the new password
      </button>
    </form>
  );
}

export function ResetRoute() {
  const [params] = useSearchParams();
  const token = params.get('token');
  return (
    <AuthFrame title="Reset the password">
      {token ? <NewPasswordForm token={token} /> : <RequestForm />}
    </AuthFrame>
  );
}
