'use client';

import katex from 'katex';
import { useMemo } from 'react';

/** Typesets TeX produced by the engine from the checked expression tree. */
export function Tex({ tex, display = false }: { tex: string; display?: boolean }) {
  const html = useMemo(() => katex.renderToString(tex, { displayMode: display, throwOnError: false, output: 'html', strict: 'ignore' }), [tex, display]);
  return <span className={display ? 'block overflow-x-auto py-1' : ''} dangerouslySetInnerHTML={{ __html: html }} />;
}
