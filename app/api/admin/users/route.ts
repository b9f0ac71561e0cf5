import { route } from '@/lib/http/handler';
import { createUser, listUsers } from '@/lib/auth/users';
import { createUserBody } from './schema';

export const GET = route('GET /api/admin/users', {}, async () => ({ items: await listUsers() }));

export const POST = route('POST /api/admin/users', { body: createUserBody }, async ({ caller, body }) =>
  createUser({ actorId: caller!.user.id, ...body }));
