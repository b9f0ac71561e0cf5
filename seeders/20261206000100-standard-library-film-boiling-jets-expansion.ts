import { seedLibrary } from './20261201000200-standard-library';

export const name = '20261206000100-standard-library-film-boiling-jets-expansion';

/**
 * The library grew again: film boiling on horizontal cylinders (Bromley with radiation; Breen & Westwater),
 * impinging round jets (Martin's single nozzle and nozzle arrays) and the sudden expansion (Borda–Carnot;
 * Hooper's 2-K form). A new installation seeds them in the first library seeder; an installation that already
 * ran the earlier seeders gets the entries it does not hold here, through the same life cycle.
 */
export async function up(): Promise<void> {
  await seedLibrary();
}

/** Nothing to undo on its own: the first library seeder's `down` removes every library entry. */
export async function down(): Promise<void> {}
