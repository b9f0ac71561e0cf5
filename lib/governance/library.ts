import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { contentHash } from '@/lib/engine/canonical';

export interface LibraryEntry {
  slug: string;
  definition: Record<string, unknown>;
  checkCases: unknown[];
}

export const LIBRARY_DIR = join(process.cwd(), 'seeders', 'correlations');

/** The standard library's definition files, one JSON file per correlation, sorted by slug. */
export function readLibrary(dir = LIBRARY_DIR): LibraryEntry[] {
  return readdirSync(dir)
    .filter((f) => f.endsWith('.json'))
    .sort()
    .map((f) => {
      const entry = JSON.parse(readFileSync(join(dir, f), 'utf8')) as LibraryEntry;
      if (`${entry.slug}.json` !== f) throw new Error(`${f}: the slug "${entry.slug}" must match the file name`);
      return entry;
    });
}

export const TEMPLATE_DIR = join(process.cwd(), 'seeders', 'templates');

type PinSource = (slug: string, version: number) => string;

/** Content hash of a standard-library version as the seeder freezes it (version 1 of each file). */
export function libraryHash(library = readLibrary()): PinSource {
  const bySlug = new Map(library.map((e) => [e.slug, e]));
  return (slug, version) => {
    const e = bySlug.get(slug);
    if (!e || version !== 1) throw new Error(`no seeded version ${version} of "${slug}"`);
    return contentHash(e.definition, e.checkCases);
  };
}

/**
 * The seeded calculation templates. Their files pin correlations by slug and version only; the
 * content hash is filled in here from `hashOf` (the database's frozen versions when seeding), so a
 * file never carries a hash that could go stale.
 */
export function readTemplates(hashOf: PinSource = libraryHash(), dir = TEMPLATE_DIR): LibraryEntry[] {
  return readdirSync(dir)
    .filter((f) => f.endsWith('.json'))
    .sort()
    .map((f) => {
      const entry = JSON.parse(readFileSync(join(dir, f), 'utf8')) as LibraryEntry;
      if (`${entry.slug}.json` !== f) throw new Error(`${f}: the slug "${entry.slug}" must match the file name`);
      const pin = (step: { kind: string; use?: { slug: string; version: number; contentHash?: string }; options?: { steps: unknown[] }[] }) => {
        if (step.use) step.use.contentHash = hashOf(step.use.slug, step.use.version);
        step.options?.forEach((o) => o.steps.forEach((s) => pin(s as never)));
      };
      (entry.definition.steps as never[]).forEach(pin);
      return entry;
    });
}
