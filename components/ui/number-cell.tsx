'use client';

import { useId, useState } from 'react';

/**
 * A number input for tables: keeps what was typed, commits on blur only when it is a number (or
 * empty, when `optional`), and otherwise says why beside the field.
 */
export function NumberCell({ label, value, onCommit, optional = false, className = 'w-28' }: {
  label: string; value: number | undefined; onCommit: (v: number | undefined) => void; optional?: boolean; className?: string;
}) {
  const id = useId();
  const [text, setText] = useState(value === undefined ? '' : String(value));
  const [error, setError] = useState('');
  function commit() {
    const t = text.trim();
    if (t === '') {
      if (optional) { setError(''); onCommit(undefined); } else setError('Enter a number');
      return;
    }
    const n = Number(t);
    if (!Number.isFinite(n)) { setError('Not a number (use e.g. 2.5e4)'); return; }
    setError('');
    onCommit(n);
  }
  return (
    <div>
      <input aria-label={label} aria-invalid={Boolean(error)} aria-describedby={error ? `${id}-err` : undefined}
        className={`field-input font-mono text-xs ${className}`} value={text} onChange={(e) => setText(e.target.value)} onBlur={commit} />
      {error && <p id={`${id}-err`} className="text-xs text-danger">{error}</p>}
    </div>
  );
}
