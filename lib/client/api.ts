/** Browser-side JSON client for Correlary's route handlers; errors keep the server's code and field issues. */
export class ApiError extends Error {
  constructor(readonly status: number, readonly code: string, message: string, readonly details?: { issues?: { path: string; message: string }[] } & Record<string, unknown>) {
    super(message);
  }

  /** Field errors keyed by the first segment of their path ("inputs.Re_L" → "inputs.Re_L" and "inputs"). */
  fieldErrors(): Record<string, string> {
    const out: Record<string, string> = {};
    for (const issue of this.details?.issues ?? []) {
      out[issue.path] ??= issue.message;
      const head = issue.path.split('.')[0];
      out[head] ??= issue.message;
    }
    return out;
  }
}

export async function api<T>(path: string, init?: { method?: string; body?: unknown }): Promise<T> {
  const res = await fetch(path, {
    method: init?.method ?? (init?.body !== undefined ? 'POST' : 'GET'),
    headers: init?.body !== undefined ? { 'content-type': 'application/json' } : undefined,
    body: init?.body !== undefined ? JSON.stringify(init.body) : undefined,
    credentials: 'same-origin',
  });
  const text = await res.text();
  const data = text ? JSON.parse(text) : null;
  if (!res.ok) {
    const err = data?.error ?? {};
    throw new ApiError(res.status, err.code ?? 'unknown', err.message ?? `Request failed (${res.status})`, err.details);
  }
  return data as T;
}
