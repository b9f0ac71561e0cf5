import { QueryTypes, type QueryInterface } from 'sequelize';

export const name = '20261204000100-library-search-index';

/**
 * A full-text index over version definitions, so that a library search finds words of the approved definitions
 * (input and output names, references, notes) through the index instead of reading every definition: the library
 * search stays fast with thousands of correlations (lib/governance/queries.ts#listCorrelations).
 */
export async function up(qi: QueryInterface): Promise<void> {
  await qi.sequelize.query('ALTER TABLE correlation_versions ADD FULLTEXT INDEX correlation_versions_definition_words (definition)', { type: QueryTypes.RAW });
}

export async function down(qi: QueryInterface): Promise<void> {
  await qi.sequelize.query('ALTER TABLE correlation_versions DROP INDEX IF EXISTS correlation_versions_definition_words', { type: QueryTypes.BULKDELETE });
}
