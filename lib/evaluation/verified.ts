import 'server-only';
import type { Transaction } from 'sequelize';
import { AppError } from '@/lib/http/errors';
import type { AuthUser } from '@/lib/auth/users';
import type { EntryKind, VersionStatus } from '@/models';
import { compiled, compiledByKey, type CompiledDefinition } from '@/lib/engine/compile';
import { compileChain, type CompiledChain, type Resolve } from '@/lib/engine/chain';
import { DefinitionError } from '@/lib/engine/analyse';
import { checkTemplateSchema } from '@/lib/engine/schema';
import { pinsOf, type ChainWarning, type Pin, type TemplateDefinition } from '@/lib/engine/template-types';
import type { Definition, Warning } from '@/lib/engine/types';
import { loadPinnedVersions, loadServableVersion, type ServableVersion } from '@/lib/governance/servable';
import { verifyFrozen } from '@/lib/governance/integrity';

/**
 * The one way to get something to evaluate: load a version the caller may use, check its frozen
 * content against its hash, and compile it (once per content hash). The API, the compare and
 * deviation screens and calculations all come through here, so none can skip the integrity check.
 */

/** Why a version that is not plainly approved is still served, as a warning beside the results. */
export function versionNotices(v: Pick<ServableVersion, 'status' | 'version' | 'withdrawnReason'>, what = 'Version'): Warning[] {
  if (v.status === 'withdrawn') {
    return [{ symbol: 'version', value: v.version, message: `${what} ${v.version} was withdrawn${v.withdrawnReason ? `: ${v.withdrawnReason}` : ''}. Do not use its results for new design work.` }];
  }
  if (v.status === 'superseded') return [{ symbol: 'version', value: v.version, message: `${what} ${v.version} is superseded by a newer approved version.` }];
  if (v.status !== 'approved') return [{ symbol: 'version', value: v.version, message: `${what} ${v.version} is ${v.status.replace('_', ' ')}, not approved: for checking only.` }];
  return [];
}

function compileServable(v: ServableVersion): CompiledDefinition {
  const parse = () => JSON.parse(v.definitionText) as Definition;
  // Frozen versions compile once per content hash (verifyFrozen has just matched the stored text to it).
  return v.contentHash ? compiledByKey(v.contentHash, parse) : compiled(parse());
}

export interface VerifiedCorrelation {
  version: ServableVersion;
  compiled: CompiledDefinition;
  notices: Warning[];
}

export async function loadVerifiedCorrelation({ actor, slug, version }: { actor: AuthUser; slug: string; version?: number }): Promise<VerifiedCorrelation> {
  const v = await loadServableVersion({ actor, slug, version });
  await verifyFrozen(v, slug);
  try {
    return { version: v, compiled: compileServable(v), notices: versionNotices(v) };
  } catch (err) {
    // Only a draft can hold a definition that does not compile: say so instead of failing.
    throw new AppError('invalid:definition', `Version ${v.version} of "${slug}" cannot be evaluated: its definition does not pass validation (${(err as Error).message.slice(0, 300)}).`);
  }
}

/** Statuses a pinned correlation may have when a template is submitted or approved. */
const PINNABLE: VersionStatus[] = ['approved'];

/**
 * Loads and verifies every correlation version a template pins and returns a resolver for the
 * chain compiler. `forApproval`: each pin must be approved (submission, sign-off); otherwise a
 * superseded or withdrawn pin still runs, with a notice.
 */
export async function resolvePins(pins: Pin[], { forApproval, transaction }: { forApproval: boolean; transaction?: Transaction }): Promise<{ resolve: Resolve; versions: Map<string, ServableVersion> }> {
  const versions = await loadPinnedVersions(pins, transaction);
  const problems = new Map<string, string>();
  for (const pin of pins) {
    const key = `${pin.slug}@${pin.version}`;
    const v = versions.get(key);
    if (!v) { problems.set(key, 'no such correlation version'); continue; }
    if (v.contentHash !== pin.contentHash) { problems.set(key, `its content hash is ${v.contentHash ?? 'not frozen'}, not the pinned ${pin.contentHash}`); continue; }
    if (forApproval && !PINNABLE.includes(v.status)) { problems.set(key, `is ${v.status.replace('_', ' ')}; a template may pin approved versions only`); continue; }
    if (!forApproval && !['approved', 'superseded', 'withdrawn'].includes(v.status)) { problems.set(key, `is ${v.status.replace('_', ' ')}`); continue; }
    await verifyFrozen(v, pin.slug);
  }
  return {
    versions,
    resolve: (pin) => {
      const key = `${pin.slug}@${pin.version}`;
      const problem = problems.get(key);
      return problem ? { problem } : compileServable(versions.get(key)!);
    },
  };
}

const chains = new Map<string, CompiledChain>();

/** A chain ready to run: a governed template version, or a project's own chain of approved steps. */
export interface RunnableChain {
  template: { id: number; slug: string; version: number; contentHash: string | null; status: VersionStatus; title: string } | null;
  chain: CompiledChain;
  /** Template status and pinned versions that are no longer approved. */
  notices: ChainWarning[];
  /** Ids of the versions used (the template's and every pinned correlation's), for usage records. */
  usedVersionIds: number[];
  /** The pinned correlations' stored definitions, for the worker pool (verified above). */
  pinned: (Pin & { definitionText: string })[];
  /** The compiled, verified correlation of each pin: what band propagation differentiates. */
  resolve: (pin: Pin) => CompiledDefinition;
}

async function prepare(definition: TemplateDefinition, cacheKey: string | null, what: string, forNewWork: boolean) {
  const pins = pinsOf(definition);
  const { resolve, versions } = await resolvePins(pins, { forApproval: false });
  let chain = cacheKey ? chains.get(cacheKey) : undefined;
  if (!chain) {
    try {
      chain = compileChain(definition, resolve);
    } catch (err) {
      throw new AppError('invalid:chain', `${what} cannot be run: ${(err as Error).message.slice(0, 400)}`, err instanceof DefinitionError ? { issues: err.issues.slice(0, 50).map((i) => ({ path: `chain${i.pointer}`, message: i.message })) } : undefined);
    }
    if (cacheKey) {
      if (chains.size > 200) chains.clear();
      chains.set(cacheKey, chain);
    }
  }
  const notices: ChainWarning[] = [];
  for (const pin of pins) {
    const pv = versions.get(`${pin.slug}@${pin.version}`)!;
    if (forNewWork && pv.status === 'withdrawn') throw new AppError('invalid:chain', `${pin.slug} version ${pin.version} was withdrawn; a new calculation cannot use it.`);
    for (const w of versionNotices(pv, `${pin.slug} version`)) notices.push({ ...w, step: stepsUsing(definition, pin)[0] ?? 'template' });
  }
  return {
    chain, notices, pinnedIds: pins.map((p) => versions.get(`${p.slug}@${p.version}`)!.id),
    pinned: pins.map((p) => ({ ...p, definitionText: versions.get(`${p.slug}@${p.version}`)!.definitionText })),
    resolve: (pin: Pin) => { const c = resolve(pin); if ('problem' in c) throw new Error(c.problem); return c; },
  };
}

export async function loadVerifiedTemplate({ actor, slug, version }: { actor: AuthUser; slug: string; version?: number }): Promise<RunnableChain> {
  const v = await loadServableVersion({ actor, slug, version, kind: 'template' as EntryKind });
  await verifyFrozen(v, slug);
  const definition = JSON.parse(v.definitionText) as TemplateDefinition;
  const { chain, notices, pinnedIds, pinned, resolve } = await prepare(definition, v.contentHash, `Version ${v.version} of the template "${slug}"`, false);
  return {
    pinned, resolve,
    template: { id: v.id, slug, version: v.version, contentHash: v.contentHash, status: v.status, title: v.title },
    chain, notices: [...versionNotices(v, 'Template version').map((w) => ({ ...w, step: 'template' })), ...notices],
    usedVersionIds: [v.id, ...pinnedIds],
  };
}

/**
 * A chain a project engineer put together (same schema as a template, not governed as one): it may
 * pin only published correlation versions, never a withdrawn one, and is checked like a template.
 */
export async function loadOwnChain(definition: unknown): Promise<RunnableChain> {
  const issues = checkTemplateSchema(definition);
  if (issues.length) {
    throw new AppError('invalid:chain', `The chain is not valid: ${issues.slice(0, 3).map((i) => `${i.pointer}: ${i.message}`).join('; ')}`, { issues: issues.slice(0, 50).map((i) => ({ path: `chain${i.pointer}`, message: i.message })) });
  }
  const { chain, notices, pinnedIds, pinned, resolve } = await prepare(definition as TemplateDefinition, null, 'The chain', true);
  return { template: null, chain, notices, usedVersionIds: pinnedIds, pinned, resolve };
}

/** Keys of the steps that use a pin. */
export function stepsUsing(def: TemplateDefinition, pin: Pin): string[] {
  const keys: string[] = [];
  for (const s of def.steps) {
    const leaves = s.kind === 'choice' ? s.options.flatMap((o) => o.steps) : [s];
    for (const l of leaves) if (l.kind === 'correlation' && l.use.slug === pin.slug && l.use.version === pin.version) keys.push(l.key);
  }
  return keys;
}
