import * as demoUsers from './20261201000100-demo-users';
import * as standardLibrary from './20261201000200-standard-library';
import * as demoScenario from './20261201000300-demo-scenario';
import * as propertyTables from './20261202000050-property-tables-from-standards';
import * as templates from './20261202000100-calculation-templates';
import * as demoCalculations from './20261202000200-demo-calculations';
import * as libraryAdditions from './20261203000100-standard-library-additions';
import * as libraryCorrections from './20261205000100-library-corrections';
import * as demoEvidence from './20261205000200-demo-evidence-document';
import * as demoCompanyGroups from './20261205000300-demo-company-groups';
import * as libraryGrowth from './20261206000100-standard-library-film-boiling-jets-expansion';

export interface Seeder {
  name: string;
  up(): Promise<void>;
  down(): Promise<void>;
}

/** Seeders in order; tracked in their own table, so each runs once per database. */
export const seeders: Seeder[] = [demoUsers, standardLibrary, demoScenario, propertyTables, templates, demoCalculations, libraryAdditions, libraryCorrections, demoEvidence, demoCompanyGroups, libraryGrowth];
