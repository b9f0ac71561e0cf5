import { route } from '@/lib/http/handler';
import { AppError } from '@/lib/http/errors';
import { findUserById } from '@/lib/auth/users';
import { createApiToken, listApiTokens } from '@/lib/api/tokens';
import { createTokenBody, listTokensQuery } from './schema';

export const GET = route('GET /api/tokens', { query: listTokensQuery }, async ({ caller, query }) => {
  const isAdmin = caller!.user.roles.includes('admin');
  if (query.all === '1' && !isAdmin) throw new AppError('forbidden:role', 'Only admins can list every token.');
  return { items: await listApiTokens({ userId: query.all === '1' ? undefined : caller!.user.id }) };
});

export const POST = route('POST /api/tokens', { body: createTokenBody }, async ({ caller, body }) => {
  const userId = body.userId ?? caller!.user.id;
  if (userId !== caller!.user.id && !caller!.user.roles.includes('admin')) {
    throw new AppError('forbidden:role', 'Only admins can create tokens for other users.');
  }
  if (userId !== caller!.user.id && !(await findUserById({ id: userId }))?.isActive) {
    throw new AppError('invalid:user', `No active user with id ${userId}.`, { issues: [{ path: 'userId', message: 'No active user with this id' }] });
  }
  const expiresAt = body.expiresInDays ? new Date(Date.now() + body.expiresInDays * 86_400_000) : null;
  return createApiToken({ actorId: caller!.user.id, userId, name: body.name, scopes: body.scopes, expiresAt });
});
