'use client';

import type { UseQueryResult } from '@tanstack/react-query';

/** Loading and error states for a react-query result, then the content. */
export function QueryState<T>({ query, children }: { query: UseQueryResult<T>; children: (data: T) => React.ReactNode }) {
  if (query.isPending) return <p className="animate-pulse text-sm text-ink-faint" role="status">Loading…</p>;
  if (query.isError) return <p role="alert" className="rounded bg-danger-bg px-3 py-2 text-sm text-danger">Could not load: {query.error.message}</p>;
  return <>{children(query.data)}</>;
}
