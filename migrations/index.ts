import type { QueryInterface } from 'sequelize';
import * as usersAndRoles from './20261201000100-users-and-roles';
import * as correlations from './20261201000200-correlations-and-versions';
import * as apiTokens from './20261201000300-api-tokens-usage-rate-limits';
import * as calculations from './20261202000100-templates-projects-calculations';
import * as throttle from './20261202000200-sign-in-throttle-and-session-versions';
import * as evidence from './20261202000300-evidence-policy';
import * as webhooks from './20261203000100-webhooks';
import * as librarySearch from './20261204000100-library-search-index';
import * as mailClaims from './20261204000200-mail-claims';
import * as attachments from './20261205000100-attachments';

export interface Migration {
  name: string;
  up(qi: QueryInterface): Promise<void>;
  down(qi: QueryInterface): Promise<void>;
}

/** Every migration in order. Add new files here; the name is what the tracking table records. */
export const migrations: Migration[] = [usersAndRoles, correlations, apiTokens, calculations, throttle, evidence, webhooks, librarySearch, mailClaims, attachments];
