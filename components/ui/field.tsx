'use client';

import { useId } from 'react';

interface ControlProps {
  id: string;
  name?: string;
  'aria-invalid': boolean;
  'aria-describedby'?: string;
}

/** A labelled form control with its error message right beside it. */
export function Field({ label, error, hint, name, children }: {
  label: string; error?: string; hint?: string; name?: string; children: (p: ControlProps) => React.ReactNode;
}) {
  const id = useId();
  const describedBy = error ? `${id}-err` : hint ? `${id}-hint` : undefined;
  return (
    <div className="space-y-1">
      <label htmlFor={id} className="block text-sm font-medium text-ink">{label}</label>
      {children({ id, name, 'aria-invalid': Boolean(error), 'aria-describedby': describedBy })}
      {error ? <p id={`${id}-err`} className="text-xs text-danger">{error}</p>
        : hint ? <p id={`${id}-hint`} className="text-xs text-ink-faint">{hint}</p> : null}
    </div>
  );
}
