'use client';

import { useState } from 'react';

/** Copies text to the clipboard and says so, on screen and to screen readers (a polite live region). */
export function CopyButton({ text, label = 'Copy', describe }: { text: string; label?: string; describe?: string }) {
  const [state, setState] = useState<'idle' | 'copied' | 'failed'>('idle');
  return (
    <span className="inline-flex items-center gap-1">
      <button type="button" className="btn-quiet px-2 py-1 text-xs" aria-label={describe ? `${label} ${describe}` : undefined} onClick={async () => {
        try {
          await navigator.clipboard.writeText(text);
          setState('copied');
        } catch {
          setState('failed');
        }
        setTimeout(() => setState('idle'), 2000);
      }}>{state === 'copied' ? 'Copied' : label}</button>
      <span role="status" aria-live="polite" className={state === 'failed' ? 'text-xs text-danger' : 'sr-only'}>
        {state === 'copied' ? 'Copied to the clipboard.' : state === 'failed' ? 'The browser did not allow copying; select the text and copy it by hand.' : ''}
      </span>
    </span>
  );
}
