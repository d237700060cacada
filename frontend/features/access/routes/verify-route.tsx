import { useMutation } from '@tanstack/react-query';
import { useEffect } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { ProblemMessage } from '../../../components/problem-message';
import { verifyEmail } from '../api/auth';
import { AuthFrame } from '../components/auth-form';

/** The page the verification link opens: it confirms the address once, then offers sign-in. */
export function VerifyRoute() {
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  const { mutate, status, error } = useMutation({ mutationFn: verifyEmail });
  useEffect(() => {
    if (token) mutate(token);
  }, [token, mutate]);
  return (
    <AuthFrame title="Confirm your address">
      {!token ? <p>This page needs the link from the confirmation mail.</p> : null}
      {status === 'pending' ? <p role="status">Confirming…</p> : null}
      {status === 'success' ? (
        <p role="status">
          Your address is confirmed.{' '}
          <Link className="text-patina-700 underline" to="/sign-in">
            Sign in
          </Link>
        </p>
      ) : null}
      {status === 'error' ? <ProblemMessage error={error} title="Not confirmed" /> : null}
    </AuthFrame>
  );
}
