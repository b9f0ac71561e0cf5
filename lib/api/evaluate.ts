import { AppError } from '@/lib/http/errors';
import type { AuthUser } from '@/lib/auth/users';
import { EvaluationError, InputError, type Definition, type Warning } from '@/lib/engine';
import { compiled, compiledByKey } from '@/lib/engine/compile';
import { loadServableVersion } from '@/lib/governance/servable';
import { verifyFrozen } from '@/lib/governance/integrity';
import { recordUsage } from './usage';

export const MAX_ROWS = 10_000;

export interface EvaluateRequest {
  version?: number;
  inputs?: Record<string, unknown>;
  rows?: unknown[];
}

function versionNotices(v: { status: string; version: number; withdrawnReason: string | null }): Warning[] {
  if (v.status === 'withdrawn') {
    return [{ symbol: 'version', value: v.version, message: `Version ${v.version} was withdrawn${v.withdrawnReason ? `: ${v.withdrawnReason}` : ''}. Do not use its results for new design work.` }];
  }
  if (v.status === 'superseded') {
    return [{ symbol: 'version', value: v.version, message: `Version ${v.version} is superseded by a newer approved version.` }];
  }
  if (v.status !== 'approved') {
    return [{ symbol: 'version', value: v.version, message: `Version ${v.version} is ${v.status.replace('_', ' ')}, not approved: for checking only.` }];
  }
  return [];
}

/**
 * Evaluates a correlation version (default: the approved one) for one input set or a batch of rows.
 * Withdrawn versions are served only when pinned, with a warning. Usage is recorded per version.
 */
export async function evaluateCorrelation({ actor, tokenId, slug, request }: { actor: AuthUser; tokenId: number | null; slug: string; request: EvaluateRequest }) {
  if (request.rows && request.rows.length > MAX_ROWS) {
    throw new AppError('too_large:rows', `A batch may hold at most ${MAX_ROWS} rows; this one has ${request.rows.length}. Split it into several requests.`);
  }
  const v = await loadServableVersion({ actor, slug, version: request.version });
  await verifyFrozen(v, slug);
  // Frozen versions compile once per content hash (verifyFrozen has just matched the stored text to it);
  // drafts (no hash) compile from their current text.
  const parse = () => JSON.parse(v.definitionText) as Definition;
  const c = v.contentHash ? compiledByKey(v.contentHash, parse) : compiled(parse());
  const notices = versionNotices(v);
  const head = { slug, version: v.version, contentHash: v.contentHash, status: v.status };

  if (request.rows) {
    const n = c.inputSymbols.length;
    const flat = new Float64Array(request.rows.length * n);
    const issues: { path: string; message: string }[] = [];
    request.rows.forEach((row, r) => {
      try {
        flat.set(c.readInputs(row, `rows[${r}]`), r * n);
      } catch (err) {
        if (err instanceof InputError) issues.push(...err.issues); else throw err;
      }
    });
    if (issues.length) {
      throw new AppError('invalid:inputs', `${issues.length} input problem${issues.length === 1 ? '' : 's'}, first: ${issues[0].path} ${issues[0].message}`, { issues: issues.slice(0, 100) });
    }
    const out = c.runMany(flat, request.rows.length);
    const m = c.outputSymbols.length;
    const results = request.rows.map((_, r) => {
      const err = out.errors.get(r);
      if (err) return { outputs: null, warnings: err.warnings, error: { code: `refused:${err.code}`, message: err.message } };
      const outputs: Record<string, number> = {};
      for (let i = 0; i < m; i++) outputs[c.outputSymbols[i]] = out.outputs[r * m + i];
      return { outputs, warnings: out.warnings.get(r) ?? [] };
    });
    recordUsage({ userId: actor.id, tokenId, versionId: v.id, evaluations: request.rows.length });
    return { ...head, ...(notices.length ? { warnings: notices } : {}), results };
  }

  try {
    const r = c.evaluate(request.inputs ?? {});
    recordUsage({ userId: actor.id, tokenId, versionId: v.id, evaluations: 1 });
    return { ...head, outputs: r.outputs, warnings: [...notices, ...r.warnings] };
  } catch (err) {
    if (err instanceof InputError) throw new AppError('invalid:inputs', `Input problem: ${err.message}`, { issues: err.issues });
    if (err instanceof EvaluationError) {
      throw new AppError(`invalid:${err.code === 'refused' ? 'refused' : err.code}`, err.message, { symbol: err.symbol, warnings: err.warnings });
    }
    throw err;
  }
}
