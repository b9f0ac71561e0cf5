'use client';

import { useState } from 'react';
import { defaultInputs } from './default-inputs';
import { CopyButton } from '@/components/ui/copy-button';
import { TabList } from '@/components/ui/tab-list';
import type { VersionDetail } from './types';

/** Copy-ready calls pinned to this version: curl, Python (requests), TypeScript (fetch). */
export function ScriptSnippets({ slug, detail }: { slug: string; detail: VersionDetail }) {
  const [tab, setTab] = useState<'curl' | 'python' | 'typescript'>('curl');
  const origin = typeof window === 'undefined' ? 'http://localhost:3000' : window.location.origin;
  const inputs = defaultInputs(detail.definition, detail.checkCases);
  const body = JSON.stringify({ version: detail.version, inputs });
  const url = `${origin}/api/correlations/${slug}/evaluate`;
  const out = detail.definition.outputs[0].symbol;
  const snippets = {
    curl: `curl -sS -X POST '${url}' \\\n  -H "Authorization: Bearer $CORRELARY_TOKEN" \\\n  -H 'Content-Type: application/json' \\\n  -d '${body}'`,
    python: `import os, requests\n\nanswer = requests.post(\n    "${url}",\n    headers={"Authorization": f"Bearer {os.environ['CORRELARY_TOKEN']}"},\n    json=${JSON.stringify({ version: detail.version, inputs }).replace(/"/g, '"')},\n    timeout=30,\n)\nanswer.raise_for_status()\nresult = answer.json()\nprint(result["outputs"]["${out}"], result["version"], result["contentHash"])\nfor w in result["warnings"]:\n    print("warning:", w["message"])`,
    typescript: `const res = await fetch('${url}', {\n  method: 'POST',\n  headers: { Authorization: \`Bearer \${process.env.CORRELARY_TOKEN}\`, 'Content-Type': 'application/json' },\n  body: JSON.stringify(${body}),\n});\nif (!res.ok) throw new Error(\`\${res.status}: \${await res.text()}\`);\nconst { outputs, warnings, version, contentHash } = await res.json();\nconsole.log(outputs.${out}, version, contentHash, warnings);`,
  };
  return (
    <section className="panel space-y-2" aria-label="Use from a script">
      <div className="flex items-center gap-2">
        <h2 className="mr-auto font-semibold">Use from a script</h2>
        <TabList label="Language" value={tab} onChange={setTab} className="flex gap-1"
          tabs={[['curl', 'curl'], ['python', 'Python'], ['typescript', 'TypeScript']]}
          tabClass={(on) => `rounded px-2 py-1 text-xs ${on ? 'bg-brand text-white' : 'bg-paper-sunk text-ink-soft'}`} />
        <CopyButton text={snippets[tab]} />
      </div>
      <pre className="overflow-x-auto rounded bg-ink p-3 text-xs leading-relaxed text-paper"><code>{snippets[tab]}</code></pre>
      <p className="text-xs text-ink-faint">Pinned to version {detail.version}. Create a token with the evaluate scope on your Account page. Batches: send <code>rows</code> (up to 10,000) instead of <code>inputs</code>.</p>
    </section>
  );
}
