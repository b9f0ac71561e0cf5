import { db } from '@/models';

/** id → name (or e-mail) of the given users, in one query; for labelling lists. */
export async function userLabels({ ids, field = 'name' }: { ids: Iterable<number | null>; field?: 'name' | 'email' }): Promise<Map<number, string>> {
  const { User } = db();
  const wanted = [...new Set([...ids].filter((x): x is number => x !== null))];
  if (wanted.length === 0) return new Map();
  const users = await User.findAll({ where: { id: wanted }, attributes: ['id', field] });
  return new Map(users.map((u) => [u.id, u[field]]));
}
