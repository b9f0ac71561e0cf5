'use client';

import { useRef } from 'react';

/** A row of tabs: click, or arrow keys / Home / End when one has focus (WAI-ARIA tabs pattern). */
export function TabList<T extends string>({ tabs, value, onChange, label, className = '', tabClass }: {
  tabs: [T, string][]; value: T; onChange: (t: T) => void; label: string; className?: string; tabClass: (selected: boolean) => string;
}) {
  const refs = useRef<(HTMLButtonElement | null)[]>([]);
  const move = (to: number) => {
    const k = (to + tabs.length) % tabs.length;
    onChange(tabs[k][0]);
    refs.current[k]?.focus();
  };
  return (
    <div role="tablist" aria-label={label} className={className}>
      {tabs.map(([t, text], k) => (
        <button key={t} ref={(el) => { refs.current[k] = el; }} role="tab" type="button" aria-selected={value === t} tabIndex={value === t ? 0 : -1}
          className={tabClass(value === t)} onClick={() => onChange(t)}
          onKeyDown={(e) => {
            if (e.key === 'ArrowRight') { e.preventDefault(); move(k + 1); }
            else if (e.key === 'ArrowLeft') { e.preventDefault(); move(k - 1); }
            else if (e.key === 'Home') { e.preventDefault(); move(0); }
            else if (e.key === 'End') { e.preventDefault(); move(tabs.length - 1); }
          }}>{text}</button>
      ))}
    </div>
  );
}
