import { db } from '@/models';
import { readLibrary, type LibraryEntry } from '@/lib/governance/library';
import { createDraftVersion, decideVersion, submitVersion, updateDraft } from '@/lib/governance/lifecycle';
import { canonicalJson } from '@/lib/engine/canonical';
import { DEMO_PASSWORD, demoActor } from './20261201000100-demo-users';

export const name = '20261205000100-library-corrections';

/**
 * Corrections of standard-library definitions found after they were approved. A new installation seeds the
 * corrected file as version 1; an installation that holds the earlier version gets the correction as a new
 * version through the life cycle (drafted, validated, approved by a second person), which supersedes the old
 * one — calculations that pinned it keep their frozen record and are offered the re-run.
 */
export const CORRECTIONS: Record<string, string> = {
  'tube-bank-pressure-drop-gaddis-gnielinski-aligned':
    'Corrects the laminar term: its denominator read (4ab/π − 1) for (4ab − π), so ξ_lam was π times too large (dominant below Re ≈ 100, 1–6 % at Re ≥ 5,000). Found by the new Stokes-flow check cases (Kuwabara 1959 cell model).',
};

export async function up(): Promise<void> {
  await applyCorrections(CORRECTIONS, readLibrary());
}

/** For each corrected slug whose latest approved definition differs from its file: a new version, validated and approved. Returns the versions made. */
export async function applyCorrections(corrections: Record<string, string>, library: LibraryEntry[]): Promise<{ slug: string; version: number }[]> {
  const author = await demoActor('author@demo.example');
  const approver = await demoActor('approver@demo.example');
  const { Correlation, CorrelationVersion } = db();
  const files = new Map(library.map((e) => [e.slug, e]));
  const made: { slug: string; version: number }[] = [];
  for (const [slug, why] of Object.entries(corrections)) {
    const entry = files.get(slug);
    const c = await Correlation.findOne({ where: { slug } });
    if (!entry || !c) continue;
    const latest = await CorrelationVersion.findOne({ where: { correlationId: c.id, status: 'approved' }, order: [['version', 'DESC']] });
    if (!latest || canonicalJson(latest.definition) === canonicalJson(entry.definition)) continue;
    const { version } = await createDraftVersion({ actor: author, slug, fromVersion: latest.version });
    await updateDraft({ actor: author, slug, version, definition: entry.definition, checkCases: entry.checkCases });
    await submitVersion({ actor: author, slug, version });
    await decideVersion({ actor: approver, slug, version, decision: 'approve', comment: `Standard library correction: ${why}`, password: DEMO_PASSWORD });
    made.push({ slug, version });
  }
  return made;
}

/** Nothing to undo on its own: a correction is a new approved version, kept like any other. */
export async function down(): Promise<void> {}
