'use client';

import { signIn, useSession } from 'next-auth/react';
import { useEffect, useState } from 'react';

/** Seconds a company-account confirmation counts as a signature (the server allows 300; a margin for the clock). */
const WINDOW_S = 285;

/** Whether the person signed in with their company account, and whether that sign-in is fresh enough to sign with. */
export function useCompanySignature() {
  const { data } = useSession();
  const [now, setNow] = useState(() => Date.now() / 1000);
  useEffect(() => { const t = setInterval(() => setNow(Date.now() / 1000), 15_000); return () => clearInterval(t); }, []);
  const company = data?.user.via === 'company';
  const authAt = data?.user.authAt ?? 0;
  return { company, fresh: company && now - authAt <= WINDOW_S, authAt };
}

const clock = (s: number) => new Date(s * 1000).toLocaleTimeString([], { hour: '2-digit', minute: '2-digit' });

/** Keeps what was typed in a sign-off form across the round trip to the company's provider. */
export function useDraftAcrossSignIn<T>(key: string, value: T, restore: (v: T) => void) {
  useEffect(() => {
    const saved = sessionStorage.getItem(key);
    if (saved) { sessionStorage.removeItem(key); try { restore(JSON.parse(saved) as T); } catch { /* an unreadable draft is dropped */ } }
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [key]);
  return () => sessionStorage.setItem(key, JSON.stringify(value));
}

/**
 * The signature of a person without a Correlary password: a fresh sign-in at the company's provider (prompt=login),
 * valid for five minutes. Shown instead of the password field.
 */
export function CompanySignature({ fresh, authAt, error, beforeLeaving, what }: { fresh: boolean; authAt: number; error?: string; beforeLeaving: () => void; what: string }) {
  return (
    <div className="space-y-1 text-sm" data-testid="company-signature">
      {fresh
        ? <p role="status" className="rounded bg-ok-bg px-3 py-2 text-ok">Identity confirmed with your company account at {clock(authAt)}; sign {what} before {clock(authAt + WINDOW_S)}.</p>
        : <p>You signed in with your company account: to sign {what}, confirm who you are there (the signature holds for five minutes).</p>}
      {!fresh && (
        <button type="button" className="btn-quiet" onClick={() => { beforeLeaving(); void signIn('company', { callbackUrl: window.location.href }, { prompt: 'login' }); }}>
          Confirm with your company account
        </button>
      )}
      {error && <p className="text-xs text-danger">{error}</p>}
    </div>
  );
}
