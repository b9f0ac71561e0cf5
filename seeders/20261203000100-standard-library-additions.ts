import { seedLibrary } from './20261201000200-standard-library';

export const name = '20261203000100-standard-library-additions';

/**
 * The standard library grew from 64 to more than 120 correlations (fins, heat exchangers, tube banks,
 * non-circular ducts, impinging jets, condensation, boiling, pressure losses, radiation and more). A new
 * installation seeds them all in the first library seeder; an installation that already ran it gets the
 * entries it does not hold here, through the same life cycle. Entries it holds keep their frozen versions.
 */
export async function up(): Promise<void> {
  await seedLibrary();
}

/** Nothing to undo on its own: the first library seeder's `down` removes every library entry. */
export async function down(): Promise<void> {}
