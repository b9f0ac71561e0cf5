'use client';

import { signOut } from 'next-auth/react';
import { useState } from 'react';
import { api } from '@/lib/client/api';

/** Ends every session of the account, on every device, this one included. */
export function EndSessions() {
  const [error, setError] = useState<string | null>(null);
  return (
    <div className="space-y-1 border-t border-line pt-4">
      <h2 className="font-semibold">Sessions</h2>
      <p className="text-xs text-ink-soft">Signing out ends every session of this account. A password change does too. API tokens are not affected; revoke them below.</p>
      <button type="button" className="btn-quiet" onClick={async () => {
        try { await api('/api/account/sessions', { method: 'DELETE' }); await signOut({ callbackUrl: '/sign-in' }); } catch (e) { setError((e as Error).message); }
      }}>Sign out everywhere</button>
      {error && <p role="alert" className="text-sm text-danger">{error}</p>}
    </div>
  );
}
