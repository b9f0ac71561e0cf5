'use client';

import { signIn } from 'next-auth/react';
import { useRouter, useSearchParams } from 'next/navigation';
import { Suspense, useState } from 'react';
import { Field } from '@/components/ui/field';

const COMPANY_ERRORS: Record<string, string> = {
  'forbidden:no-role': 'Your company account is in no group that Correlary gives a role to; ask a Correlary admin.',
  'forbidden:inactive': 'Your Correlary account is deactivated; ask a Correlary admin.',
  'forbidden:company-email': 'Your company account has no verified e-mail address; Correlary cannot tell who you are.',
  unavailable: 'Sign-in with your company account is unavailable just now; please try again.',
};

function Form({ company }: { company: boolean }) {
  const router = useRouter();
  const params = useSearchParams();
  const [email, setEmail] = useState('');
  const [password, setPassword] = useState('');
  const [errors, setErrors] = useState<{ email?: string; password?: string; form?: string }>({});
  const [busy, setBusy] = useState(false);
  const companyError = params.get('company') ? COMPANY_ERRORS[params.get('company')!] ?? COMPANY_ERRORS.unavailable : null;
  const callbackUrl = params.get('callbackUrl')?.startsWith('/') ? params.get('callbackUrl')! : '/library';

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
    router.push(callbackUrl);
    router.refresh();
  }

  return (
    <form onSubmit={submit} noValidate className="panel space-y-4" aria-label="Sign in">
      <h1 className="text-lg font-semibold">Sign in</h1>
      {errors.form && <p role="alert" className="rounded bg-danger-bg px-3 py-2 text-sm text-danger">{errors.form}</p>}
      {companyError && <p role="alert" className="rounded bg-danger-bg px-3 py-2 text-sm text-danger">{companyError}</p>}
      {company && (
        <>
          <button type="button" className="btn-primary w-full justify-center" onClick={() => { setBusy(true); void signIn('company', { callbackUrl }); }} disabled={busy}>Sign in with your company account</button>
          <p className="text-center text-xs text-ink-faint">or with a Correlary password</p>
        </>
      )}
      <Field label="E-mail" error={errors.email}>
        {(p) => <input {...p} type="email" autoComplete="username" value={email} onChange={(e) => setEmail(e.target.value)} className="field-input" />}
      </Field>
      <Field label="Password" error={errors.password}>
        {(p) => <input {...p} type="password" autoComplete="current-password" value={password} onChange={(e) => setPassword(e.target.value)} className="field-input" />}
      </Field>
      <button type="submit" className={`${company ? 'btn-quiet' : 'btn-primary'} w-full justify-center`} disabled={busy}>{busy ? 'Signing in…' : 'Sign in'}</button>
    </form>
  );
}

export function SignInForm({ company }: { company: boolean }) {
  return <Suspense><Form company={company} /></Suspense>;
}
