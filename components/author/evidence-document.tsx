'use client';

import { useRef, useState } from 'react';
import { api, ApiError } from '@/lib/client/api';

export interface AttachmentRef { id: string; sha256: string; mediaType: string; name: string }

const MAX_BYTES = 5 * 1024 * 1024;

/** Reads a file as base64 (without the data-URL prefix). */
function toBase64(file: File): Promise<string> {
  return new Promise((resolve, reject) => {
    const r = new FileReader();
    r.onload = () => resolve(String(r.result).replace(/^data:[^,]*,/, ''));
    r.onerror = () => reject(r.error ?? new Error('could not read the file'));
    r.readAsDataURL(file);
  });
}

/**
 * The evidence document behind one check case: attach a PDF, PNG or JPEG (the server detects the type from the
 * content and keeps it in object storage), open it, or remove it. Its SHA-256 becomes part of the version's hash.
 */
export function EvidenceDocument({ label, value, onChange }: { label: string; value?: AttachmentRef; onChange: (a: AttachmentRef | undefined) => void }) {
  const input = useRef<HTMLInputElement>(null);
  const [state, setState] = useState<{ busy: boolean; error: string | null }>({ busy: false, error: null });

  async function attach(file: File) {
    if (file.size > MAX_BYTES) { setState({ busy: false, error: `"${file.name}" is ${(file.size / 1048576).toFixed(1)} MB; attach at most 5 MB (the page that holds the value).` }); return; }
    setState({ busy: true, error: null });
    try {
      const a = await api<AttachmentRef & { size: number }>('/api/attachments', { body: { name: file.name, content: await toBase64(file) } });
      onChange({ id: a.id, sha256: a.sha256, mediaType: a.mediaType, name: a.name });
      setState({ busy: false, error: null });
    } catch (err) {
      setState({ busy: false, error: err instanceof ApiError ? err.message : (err as Error).message });
    } finally {
      if (input.current) input.current.value = '';
    }
  }

  return (
    <div className="flex flex-wrap items-center gap-2 text-xs">
      <span className="text-ink-soft">Source document:</span>
      {value ? (
        <>
          <a className="text-brand-dark underline" href={`/api/attachments/${value.id}`} target="_blank" rel="noreferrer" data-testid="attachment-link">{value.name}</a>
          <span className="font-mono text-ink-faint" title={`SHA-256 ${value.sha256}`}>{value.sha256.slice(0, 12)}…</span>
          <button type="button" className="btn-quiet px-2 py-0.5 text-xs" aria-label={`Remove the source document of ${label}`} onClick={() => onChange(undefined)}>Remove</button>
        </>
      ) : <span className="text-ink-faint">none</span>}
      <label className="btn-quiet cursor-pointer px-2 py-0.5 text-xs focus-within:outline focus-within:outline-2 focus-within:outline-brand">
        {state.busy ? 'Uploading…' : value ? 'Replace…' : 'Attach PDF or image…'}
        <input ref={input} type="file" className="sr-only" accept="application/pdf,image/png,image/jpeg" aria-label={`Source document of ${label}`} disabled={state.busy}
          onChange={(e) => { const f = e.target.files?.[0]; if (f) void attach(f); }} />
      </label>
      {state.error && <span role="alert" className="text-danger">{state.error}</span>}
    </div>
  );
}
