'use client';

import { signIn } from 'next-auth/react';
import { useRouter, useSearchParams } from 'next/navigation';
import { Suspense, useState } from 'react';
import { Field } from '@/components/ui/field';

function Form() {
  const router = useRouter();
  const params = useSearchParams();
  const [email, setEmail] = useState('');
  const [password, setPassword] = useState('');
  const [errors, setErrors] = useState<{ email?: string; password?: string; form?: string }>({});
  const [busy, setBusy] = useState(false);

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    const next: typeof errors = {};
    if (!email.trim()) next.email = 'Enter your e-mail address';
    else if (email.length > 190) next.email = 'E-mail address is too long (190 characters at most)';
    if (!password) next.password = 'Enter your password';
    else if (password.length > 128) next.password = 'Password is too long (128 characters at most)';
    setErrors(next);
    if (next.email || next.password) return;
    setBusy(true);
    const result = await signIn('credentials', { email, password, redirect: false });
    setBusy(false);
    if (!result || result.error) {
      setErrors({ form: result?.error && result.error !== 'CredentialsSignin' ? result.error : 'E-mail or password is not correct.' });
      return;
    }
    router.push(params.get('callbackUrl')?.startsWith('/') ? params.get('callbackUrl')! : '/library');
    router.refresh();
  }

  return (
    <form onSubmit={submit} noValidate className="panel space-y-4" aria-label="Sign in">
      <h1 className="text-lg font-semibold">Sign in</h1>
      {errors.form && <p role="alert" className="rounded bg-danger-bg px-3 py-2 text-sm text-danger">{errors.form}</p>}
      <Field label="E-mail" error={errors.email}>
        {(p) => <input {...p} type="email" autoComplete="username" value={email} onChange={(e) => setEmail(e.target.value)} className="field-input" />}
      </Field>
      <Field label="Password" error={errors.password}>
        {(p) => <input {...p} type="password" autoComplete="current-password" value={password} onChange={(e) => setPassword(e.target.value)} className="field-input" />}
      </Field>
      <button type="submit" className="btn-primary w-full justify-center" disabled={busy}>{busy ? 'Signing in…' : 'Sign in'}</button>
    </form>
  );
}

export function SignInForm() {
  return <Suspense><Form /></Suspense>;
}
