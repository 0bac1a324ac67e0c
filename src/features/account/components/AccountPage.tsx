import { useQuery } from '@tanstack/react-query';
import { useState, type FormEvent } from 'react';
import { Link, useNavigate } from 'react-router';
import type { ApiError } from '../../../api/client';
import { meQuery, useChangePassword, useSignOut } from '../../../api/session';
import { Notice } from '../../../components/Notice';
import { TextField } from '../../../components/TextField';
import { unsyncedQuery } from '../../../store/hooks';

export function AccountPage() {
  const me = useQuery(meQuery);
  const unsynced = useQuery(unsyncedQuery);
  const signOut = useSignOut();
  const navigate = useNavigate();
  const [current, setCurrent] = useState('');
  const [next, setNext] = useState('');
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const changePassword = useChangePassword();
  if (me.isPending) return <p className="text-muted">Opening…</p>;
  if (!me.data)
    return (
      <p>
        You are not signed in.{' '}
        <Link to="/signin" className="text-teal">
          Sign in
        </Link>
      </p>
    );
  const change = async (e: FormEvent) => {
    e.preventDefault();
    try {
      await changePassword.mutateAsync({ currentPassword: current, newPassword: next });
      setCurrent('');
      setNext('');
      setMessage({ ok: true, text: 'Password changed. Your other sessions are signed out.' });
    } catch (err) {
      setMessage({ ok: false, text: (err as ApiError).message });
    }
  };
  // scenarios in shared or personal sets whose edits have not reached the service
  const waiting = (unsynced.data?.pending ?? 0) + (unsynced.data?.conflicts ?? 0);
  const leave = () => {
    if (
      waiting > 0 &&
      !confirm(
        `${waiting} scenario(s) have edits that are not on the service yet. They stay on this device and sync when you sign in again. Sign out?`,
      )
    )
      return;
    signOut.mutate(undefined, { onSettled: () => void navigate('/') });
  };
  return (
    <section className="max-w-md space-y-6">
      <h1 className="text-2xl font-semibold">Account</h1>
      <p>
        {me.data.user.name} · {me.data.user.email}
        {me.data.offline && <span className="text-muted"> (offline: from this device)</span>}
      </p>
      <form onSubmit={change} className="space-y-3" aria-label="change password">
        <h2 className="text-lg font-semibold">Change password</h2>
        <TextField
          label="Current password"
          type="password"
          value={current}
          onChange={setCurrent}
          autoComplete="current-password"
        />
        <TextField
          label="New password (10 characters or more)"
          type="password"
          value={next}
          onChange={setNext}
          autoComplete="new-password"
        />
        <button type="submit" className="rounded-md bg-teal px-4 py-1.5 font-semibold text-paper">
          Change password
        </button>
        <Notice message={message} />
      </form>
      <div className="space-y-2">
        <h2 className="text-lg font-semibold">Sign out</h2>
        <p className="text-sm text-muted">
          Scenarios stay on this device after you sign out.
          {waiting > 0 &&
            ` ${waiting} scenario(s) have edits that have not reached the service yet.`}
        </p>
        <button type="button" onClick={leave} className="rounded-md border border-rule px-4 py-1.5">
          Sign out
        </button>
      </div>
    </section>
  );
}
