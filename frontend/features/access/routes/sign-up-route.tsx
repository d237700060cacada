import { zodResolver } from '@hookform/resolvers/zod';
import { useMutation } from '@tanstack/react-query';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router-dom';
import type { z } from 'zod';
import { ProblemMessage } from '../../../components/problem-message';
import { setFieldErrors, type FormFieldMap } from '../../../lib/field-errors';
import { signUp } from '../api/auth';
import { AuthFrame, submitClass, TextField } from '../components/auth-form';
import { signUpSchema } from '../schemas';

type Values = z.infer<typeof signUpSchema>;
const fields: FormFieldMap<Values> = {
  name: { name: 'name', label: 'Name' },
  email: { name: 'email', label: 'E-mail' },
  password: { name: 'password', label: 'Password' },
};

export function SignUpRoute() {
  const mutation = useMutation({ mutationFn: signUp });
  const { register, handleSubmit, formState, setError } = useForm<Values>({
    resolver: zodResolver(signUpSchema),
  });
  if (mutation.isSuccess) {
    return (
      <AuthFrame title="Check your mail">
        <p role="status">{mutation.data.detail} Follow it to confirm the address, then sign in.</p>
      </AuthFrame>
    );
  }
  return (
    <AuthFrame
      title="Create an account"
      footer={
        <Link className="text-patina-700 underline" to="/sign-in">
          Already have one? Sign in
        </Link>
      }
    >
      <form
        noValidate
        className="flex flex-col gap-3"
        onSubmit={handleSubmit((v) =>
          mutation.mutate(v, { onError: (e) => setFieldErrors(e, setError, fields) }),
        )}
      >
        <TextField
          id="name"
          label="Name"
          autoComplete="name"
          error={formState.errors.name}
          registration={register('name')}
        />
        <TextField
          id="email"
          label="E-mail"
          type="email"
          autoComplete="email"
          error={formState.errors.email}
          registration={register('email')}
        />
        <TextField
          id="password"
          label="Password (8 to 64 characters)"
          type="password"
          autoComplete="new-password"
          error={formState.errors.password}
          registration={register('password')}
        />
        {mutation.isError ? (
          <ProblemMessage error={mutation.error} title="Not signed up" fields={fields} />
        ) : null}
        <button type="submit" className={submitClass} disabled={mutation.isPending}>
          {mutation.isPending ? 'Sending…' : 'Create the account'}
        </button>
      </form>
    </AuthFrame>
  );
}
