import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import type { z } from 'zod';
import { ProblemMessage } from '../../../components/problem-message';
import { setFieldErrors, type FormFieldMap } from '../../../lib/field-errors';
import { safeReturnPath } from '../../../lib/session';
import { useSavedStacks } from '../../../lib/stack-drafts';
import { useSignIn } from '../api/auth';
import { AuthFrame, submitClass, TextField } from '../components/auth-form';
import { signInSchema } from '../schemas';

type Values = z.infer<typeof signInSchema>;
const fields: FormFieldMap<Values> = {
  email: { name: 'email', label: 'E-mail' },
  password: { name: 'password', label: 'Password' },
};

export function SignInRoute() {
  const navigate = useNavigate();
  const [params] = useSearchParams();
  // Back to where the person was (a path on this site only); Access when they came here directly.
  const next = safeReturnPath(params.get('next')) ?? '/access';
  const [saved] = useSavedStacks();
  const signIn = useSignIn(() => saved);
  const { register, handleSubmit, formState, setError } = useForm<Values>({
    resolver: zodResolver(signInSchema),
  });
  return (
    <AuthFrame
      title="Sign in"
      footer={
        <p className="flex flex-wrap gap-4">
          <Link className="text-patina-700 underline" to="/sign-up">
            Create an account
          </Link>
          <Link className="text-patina-700 underline" to="/reset">
            Forgot the password?
          </Link>
        </p>
      }
    >
      <form
        noValidate
        className="flex flex-col gap-3"
        onSubmit={handleSubmit((v) =>
          signIn.mutate(v, {
            onSuccess: () => navigate(next, { replace: true }),
            onError: (e) => setFieldErrors(e, setError, fields),
          }),
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
        <TextField
          id="password"
          label="Password"
          type="password"
          autoComplete="current-password"
          error={formState.errors.password}
          registration={register('password')}
        />
        {signIn.isError ? (
          <ProblemMessage error={signIn.error} title="Not signed in" fields={fields} />
        ) : null}
        <button type="submit" className={submitClass} disabled={signIn.isPending}>
          {signIn.isPending ? 'Signing in…' : 'Sign in'}
        </button>
      </form>
    </AuthFrame>
  );
}
