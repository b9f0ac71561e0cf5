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

// The editor in the product's own palette: ink on warm paper, keys in the action teal, numbers in the amber of
// range warnings' neighbour, strings in the ink's softer tone.
monaco.editor.defineTheme('correlary-paper', {
  base: 'vs', inherit: true,
  rules: [
    { token: 'string.key.json', foreground: '0a464b', fontStyle: 'bold' },
    { token: 'string.value.json', foreground: '4a5866' },
    { token: 'number.json', foreground: '9a5b00' },
    { token: 'keyword.json', foreground: '6b4fa0' },
    { token: 'delimiter', foreground: '5f6b78' },
  ],
  colors: {
    'editor.background': '#faf8f4', 'editor.foreground': '#1d2630', 'editorLineNumber.foreground': '#8a8f96',
    'editorLineNumber.activeForeground': '#1d2630', 'editor.lineHighlightBackground': '#f1ede5', 'editor.selectionBackground': '#d9ecec',
    'editorCursor.foreground': '#0f5f66', 'editorIndentGuide.background1': '#e6e0d4', 'editorWidget.background': '#ffffff', 'editorWidget.border': '#d8d1c4',
  },
});

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
    <div className="space-y-1">
      <div className="overflow-hidden rounded border border-line" data-testid="json-editor">
        <Editor height={height} language="json" path={path} defaultValue={defaultValue} onChange={(v) => onChange(v ?? '')} theme="correlary-paper"
          options={{ minimap: { enabled: false }, fontSize: 13, tabSize: 2, scrollBeyondLastLine: false, wordWrap: 'on', automaticLayout: true, fixedOverflowWidgets: true, unicodeHighlight: { ambiguousCharacters: false }, renderLineHighlight: 'line', overviewRulerLanes: 0, ariaLabel: 'Definition JSON editor. Tab indents; press Control+M to let Tab move the focus out.' }} />
      </div>
      <p className="text-xs text-ink-soft">In the editor, Tab indents. Press <kbd>Ctrl</kbd>+<kbd>M</kbd> to let Tab move the focus on (and again to switch back).</p>
    </div>
  );
}
