import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';

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
