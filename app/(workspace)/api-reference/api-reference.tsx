'use client';

import { useQuery } from '@tanstack/react-query';
import { api } from '@/lib/client/api';
import { QueryState } from '@/components/ui/query-state';

interface Operation { operationId: string; summary: string; parameters?: { name: string; in: string; required: boolean; schema: object }[]; requestBody?: { content: Record<string, { schema: object }> }; responses: Record<string, { description?: string; $ref?: string }> }
interface Doc { info: { title: string; version: string; description: string }; paths: Record<string, Record<string, Operation>> }

const PYTHON_EXAMPLE = `# curl -O <this server>/api/clients/correlary.py
from correlary import Client, verify_webhook
c = Client("<this server>", token="crl_…")
r = c.evaluate("pipe-turbulent-gnielinski", {"Re_D": 3e4, "Pr": 4.3}, version=1)
print(r["outputs"]["Nu_D"], r["version"], r["contentHash"])`;

/** The API reference, rendered from /api/openapi.json (itself generated from the handlers' zod schemas). */
export function ApiReference({ typedExample }: { typedExample: string }) {
  const q = useQuery({ queryKey: ['openapi'], queryFn: () => api<Doc>('/api/openapi.json') });
  return (
    <QueryState query={q}>
      {(doc) => (
        <div className="space-y-4">
          <header>
            <h1 className="text-xl font-semibold">{doc.info.title} <span className="font-mono text-sm text-ink-soft">{doc.info.version}</span></h1>
            <p className="text-sm text-ink-soft">{doc.info.description}</p>
            <details className="mt-2">
              <summary className="cursor-pointer text-sm font-medium">Typed TypeScript client (openapi-fetch with types generated from this description)</summary>
              <pre className="mt-1 overflow-x-auto rounded bg-paper-sunk p-2 text-xs" data-testid="typed-example">{typedExample}</pre>
            </details>
            <details>
              <summary className="cursor-pointer text-sm font-medium">Python client (standard library only)</summary>
              <pre className="mt-1 overflow-x-auto rounded bg-paper-sunk p-2 text-xs">{PYTHON_EXAMPLE}</pre>
            </details>
            <p className="mt-1 text-sm">Machine-readable: <a className="text-brand-dark underline" href="/api/openapi.json">/api/openapi.json</a> (OpenAPI 3.1). Send <code>Authorization: Bearer &lt;token&gt;</code>; errors answer <code>{'{ "error": { "code", "message", "details"? } }'}</code>.</p>
          </header>
          {Object.entries(doc.paths).map(([path, ops]) => Object.entries(ops).map(([method, op]) => (
            <section key={`${method} ${path}`} className="panel space-y-2" id={op.operationId}>
              <h2 className="font-mono text-sm"><span className="mr-2 rounded bg-brand px-1.5 py-0.5 text-xs font-semibold uppercase text-white">{method}</span>{path}</h2>
              <p className="text-sm">{op.summary}</p>
              {op.parameters && op.parameters.length > 0 && (
                <table className="table-plain"><thead><tr><th>Parameter</th><th>In</th><th>Required</th><th>Schema</th></tr></thead>
                  <tbody>{op.parameters.map((p) => <tr key={p.name}><td className="font-mono">{p.name}</td><td>{p.in}</td><td>{p.required ? 'yes' : 'no'}</td><td className="font-mono text-xs">{JSON.stringify(p.schema)}</td></tr>)}</tbody></table>
              )}
              {op.requestBody && <details><summary className="cursor-pointer text-sm font-medium">Request body schema</summary><pre className="overflow-x-auto rounded bg-paper-sunk p-2 text-xs">{JSON.stringify(op.requestBody.content['application/json'].schema, null, 2)}</pre></details>}
              <p className="text-xs text-ink-soft">Answers: {Object.entries(op.responses).map(([code, r]) => `${code}${r.description ? ` ${r.description}` : ''}`).join(' · ')}</p>
            </section>
          )))}
        </div>
      )}
    </QueryState>
  );
}
