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
/** Second versions of property tables, generated from the standard formulations (scripts/property-tables.py). */
export const PROPERTY_TABLE_DIR = join(process.cwd(), 'seeders', 'property-tables');

/** The generated property tables that replace version 1 of their entries (published as version 2). */
export function readPropertyTables(dir = PROPERTY_TABLE_DIR): LibraryEntry[] {
  return readLibrary(dir);
}

/** The content a seeded version holds: version 1 from the library file, version 2 from a generated table. */
export function seededVersion(slug: string, version: number, library = readLibrary(), tables = readPropertyTables()): LibraryEntry | undefined {
  if (version === 1) return library.find((e) => e.slug === slug);
  if (version === 2) return tables.find((e) => e.slug === slug);
  return undefined;
}

type PinSource = (slug: string, version: number) => string;

/** Content hash of a standard-library version as the seeder freezes it (version 1, or 2 for a generated table). */
export function libraryHash(library = readLibrary(), tables = readPropertyTables()): PinSource {
  return (slug, version) => {
    const e = seededVersion(slug, version, library, tables);
    if (!e) throw new Error(`no seeded version ${version} of "${slug}"`);
    return contentHash(e.definition, e.checkCases);
  };
}

/**
 * The seeded calculation templates. Their files pin correlations by slug and version only; the
 * content hash is filled in here from `hashOf` (the database's frozen versions when seeding), so a
 * file never carries a hash that could go stale.
 */
export function readTemplates(hashOf: PinSource = libraryHash(), dir = TEMPLATE_DIR): LibraryEntry[] {
  return readLibrary(dir).map((entry) => {
    const pin = (step: { kind: string; use?: { slug: string; version: number; contentHash?: string }; options?: { steps: unknown[] }[] }) => {
      if (step.use) step.use.contentHash = hashOf(step.use.slug, step.use.version);
      step.options?.forEach((o) => o.steps.forEach((s) => pin(s as never)));
    };
    (entry.definition.steps as never[]).forEach(pin);
    return entry;
  });
}
