'use client';

import Editor, { loader } from '@monaco-editor/react';
import { monaco, jsonDefaults } from './monaco-setup';

// Monaco runs from the local package; without loader.config it would fetch itself from a CDN.
type WorkerFactory = { getWorker(id: string, label: string): Worker };
(self as unknown as { MonacoEnvironment: WorkerFactory }).MonacoEnvironment = {
  getWorker(_id, label) {
    if (label === 'json') return new Worker(new URL('monaco-editor/language/json/json.worker.js', import.meta.url), { type: 'module' });
    return new Worker(new URL('monaco-editor/editor/editor.worker.js', import.meta.url), { type: 'module' });
  },
};
loader.config({ monaco });

const configured = new Set<string>();

/**
 * Uncontrolled Monaco JSON editor (a controlled value drops keystrokes under automation). The JSON
 * Schema, when given, drives inline errors and completion for documents at `path`.
 */
export default function JsonEditor({ path, defaultValue, onChange, schema, height = 460 }: {
  path: string; defaultValue: string; onChange: (text: string) => void; schema?: object; height?: number;
}) {
  if (schema && !configured.has(path)) {
    configured.add(path);
    const existing = jsonDefaults.diagnosticsOptions.schemas ?? [];
    jsonDefaults.setDiagnosticsOptions({
      validate: true, allowComments: false, enableSchemaRequest: false,
      schemas: [...existing.filter((s) => !s.fileMatch?.includes(path)), { uri: `https://correlary.local/schemas/${path}`, fileMatch: [path], schema }],
    });
  }
  return (
    <div className="overflow-hidden rounded border border-line" data-testid="json-editor">
      <Editor height={height} language="json" path={path} defaultValue={defaultValue} onChange={(v) => onChange(v ?? '')}
        options={{ minimap: { enabled: false }, fontSize: 13, tabSize: 2, scrollBeyondLastLine: false, wordWrap: 'on', automaticLayout: true, fixedOverflowWidgets: true, unicodeHighlight: { ambiguousCharacters: false } }} />
    </div>
  );
}
