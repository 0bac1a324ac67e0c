/** The pages behind e-mailed links: choosing a new password, and accepting a desk invite. */
import { useQuery } from '@tanstack/react-query';
import { useState, type FormEvent } from 'react';
import { Link, useSearchParams } from 'react-router';
import type { ApiError } from '../../../api/client';
import { meQuery, useAcceptInvite, useResetPassword } from '../../../api/session';
import { Notice } from '../../../components/Notice';
import { TextField } from '../../../components/TextField';

export function ResetPage() {
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  const [password, setPassword] = useState('');
  const resetPassword = useResetPassword();
  const [result, setResult] = useState<{ ok: boolean; text: string } | null>(null);
  const submit = async (e: FormEvent) => {
    e.preventDefault();
    try {
      await resetPassword.mutateAsync({ token, newPassword: password });
      setResult({ ok: true, text: 'Password changed; every session was signed out.' });
    } catch (err) {
      setResult({ ok: false, text: (err as ApiError).message });
    }
  };
  return (
    <section className="mx-auto max-w-sm space-y-4">
      <h1 className="text-2xl font-semibold">Choose a new password</h1>
      {!token ? (
        <p role="alert" className="text-stressed">
          This link has no token; open the link from the e-mail.
        </p>
      ) : (
        <form onSubmit={submit} className="space-y-3">
          <TextField
            label="New password (10 characters or more)"
            type="password"
            value={password}
            onChange={setPassword}
            autoComplete="new-password"
          />
          <button type="submit" className="rounded-md bg-teal px-4 py-1.5 font-semibold text-paper">
            Set password
          </button>
        </form>
      )}
      <Notice message={result}>
        {result?.ok && (
          <Link to="/signin" className="underline">
            Sign in
          </Link>
        )}
      </Notice>
    </section>
  );
}

export function InvitePage() {
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  const me = useQuery(meQuery);
  const acceptInvite = useAcceptInvite();
  const [result, setResult] = useState<{ ok: boolean; text: string } | null>(null);
  const accept = async () => {
    try {
      const r = await acceptInvite.mutateAsync(token);
      setResult({ ok: true, text: `You joined "${r.desk.name}" as ${r.desk.role}.` });
    } catch (err) {
      setResult({ ok: false, text: (err as ApiError).message });
    }
  };
  return (
    <section className="mx-auto max-w-md space-y-4">
      <h1 className="text-2xl font-semibold">Desk invite</h1>
      {me.isPending ? (
        <p className="text-muted">Opening…</p>
      ) : !me.data ? (
        <p>
          Sign in (or create an account) with the invited e-mail address first:{' '}
          <Link
            className="text-teal"
            to={`/signin?next=${encodeURIComponent(`/invite?token=${token}`)}`}
          >
            sign in
          </Link>
          .
        </p>
      ) : (
        <button
          type="button"
          onClick={() => void accept()}
          disabled={result?.ok}
          className="rounded-md bg-teal px-4 py-1.5 font-semibold text-paper disabled:opacity-60"
        >
          Accept as {me.data.user.email}
        </button>
      )}
      <Notice message={result}>
        {result?.ok && (
          <Link to="/desk" className="underline">
            Open the Desk page
          </Link>
        )}
      </Notice>
    </section>
  );
}
