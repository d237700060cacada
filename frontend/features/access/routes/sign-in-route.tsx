import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { Link, useNavigate } from 'react-router-dom';
import type { z } from 'zod';
import { ProblemMessage } from '../../../components/problem-message';
import { useSavedStacks } from '../../../lib/stack-drafts';
import { useSignIn } from '../api/auth';
import { AuthFrame, submitClass, TextField } from '../components/auth-form';
import { signInSchema } from '../schemas';

export function SignInRoute() {
  const navigate = useNavigate();
  const [saved] = useSavedStacks();
  const signIn = useSignIn(() => saved);
  const { register, handleSubmit, formState } = useForm<z.infer<typeof signInSchema>>({
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
        onSubmit={handleSubmit((v) => signIn.mutate(v, { onSuccess: () => navigate('/access') }))}
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
        {signIn.isError ? <ProblemMessage error={signIn.error} title="Not signed in" /> : null}
        <button type="submit" className={submitClass} disabled={signIn.isPending}>
          {signIn.isPending ? 'Signing in…' : 'Sign in'}
        </button>
      </form>
    </AuthFrame>
  );
}
