import * as demoUsers from './20261201000100-demo-users';

export interface Seeder {
  name: string;
  up(): Promise<void>;
  down(): Promise<void>;
}

/** Seeders in order; tracked in their own table, so each runs once per database. */
export const seeders: Seeder[] = [demoUsers];
