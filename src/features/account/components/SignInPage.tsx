import { useState, type FormEvent } from 'react';
import { useNavigate, useSearchParams } from 'react-router';
import type { ApiError } from '../../../api/client';
import { useRegister, useRequestReset, useSignIn } from '../../../api/session';
import { TextField } from '../../../components/TextField';

type Mode = 'sign-in' | 'register' | 'forgot';

/** Sign in, create an account, or ask for a reset link. Working signed out is always possible. */
export function SignInPage() {
  const [mode, setMode] = useState<Mode>('sign-in');
  const [email, setEmail] = useState('');
  const [password, setPassword] = useState('');
  const [name, setName] = useState('');
  const [error, setError] = useState<{ message: string; path?: string } | null>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const requestReset = useRequestReset();
  const signIn = useSignIn();
  const register = useRegister();
  const navigate = useNavigate();
  const [params] = useSearchParams();
  const next = params.get('next') ?? '/library';
  const busy = signIn.isPending || register.isPending;

  const submit = async (e: FormEvent) => {
    e.preventDefault();
    setError(null);
    setNotice(null);
    try {
      if (mode === 'forgot') {
        const r = await requestReset.mutateAsync(email);
        setNotice(r.message);
        return;
      }
      if (mode === 'register') await register.mutateAsync({ email, password, name });
      await signIn.mutateAsync({ email, password });
      void navigate(next);
    } catch (err) {
      const a = err as ApiError;
      setError({ message: a.message, path: a.path });
    }
  };
  const fieldError = (field: string) =>
    error?.path === `body.${field}` ? error.message.replace(/^body\.\w+: /, '') : null;

  return (
    <section className="mx-auto max-w-sm space-y-4">
      <h1 className="text-2xl font-semibold">
        {mode === 'register'
          ? 'Create an account'
          : mode === 'forgot'
            ? 'Reset password'
            : 'Sign in'}
      </h1>
      <p className="text-sm text-muted">
        Signing in shares scenario sets with your desk. Everything else works signed out, on this
        device only.
      </p>
      <form onSubmit={submit} className="space-y-3" aria-label={mode}>
        {mode === 'register' && (
          <TextField label="Name" value={name} onChange={setName} error={fieldError('name')} />
        )}
        <TextField
          label="E-mail"
          type="email"
          value={email}
          onChange={setEmail}
          autoComplete="username"
          error={fieldError('email')}
        />
        {mode !== 'forgot' && (
          <TextField
            label="Password"
            type="password"
            value={password}
            onChange={setPassword}
            autoComplete={mode === 'register' ? 'new-password' : 'current-password'}
            error={fieldError('password')}
          />
        )}
        {error && !error.path && (
          <p role="alert" className="text-sm text-stressed">
            {error.message}
          </p>
        )}
        {notice && (
          <p role="status" className="text-sm text-teal">
            {notice}
          </p>
        )}
        <button
          type="submit"
          disabled={busy}
          className="rounded-md bg-teal px-4 py-1.5 font-semibold text-paper disabled:opacity-60"
        >
          {mode === 'register'
            ? 'Create account'
            : mode === 'forgot'
              ? 'Send reset link'
              : 'Sign in'}
        </button>
      </form>
      <div className="flex gap-4 text-sm">
        {(['sign-in', 'register', 'forgot'] as const)
          .filter((m) => m !== mode)
          .map((m) => (
            <button key={m} type="button" className="text-teal" onClick={() => setMode(m)}>
              {m === 'sign-in'
                ? 'I have an account'
                : m === 'register'
                  ? 'Create an account'
                  : 'Forgot password?'}
            </button>
          ))}
      </div>
    </section>
  );
}
