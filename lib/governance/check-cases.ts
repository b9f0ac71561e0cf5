import type { Transaction } from 'sequelize';
import { db } from '@/models';
import type { CheckCase } from '@/lib/engine/types';

/** A version's check cases in their stored order. */
export async function checkCasesOfVersion(versionId: number, transaction?: Transaction): Promise<CheckCase[]> {
  const { CheckCaseRow } = db();
  return (await CheckCaseRow.findAll({ where: { versionId }, order: [['position', 'ASC']], transaction })).map((r) => r.body as CheckCase);
}
