import { route } from '@/lib/http/handler';
import { createUser, listUsers } from '@/lib/auth/users';
import { createUserBody } from './schema';

export const GET = route({ access: { roles: ['admin'] } }, async () => ({ items: await listUsers() }));

export const POST = route({ access: { roles: ['admin'] }, body: createUserBody }, async ({ caller, body }) =>
  createUser({ actorId: caller!.user.id, ...body }));
