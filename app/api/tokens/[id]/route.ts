import { route } from '@/lib/http/handler';
import { revokeApiToken } from '@/lib/api/tokens';
import { tokenIdParams } from '../schema';

export const DELETE = route('DELETE /api/tokens/{id}', { params: tokenIdParams }, async ({ caller, params }) => {
  const row = await revokeApiToken({ actorId: caller!.user.id, tokenId: params.id, isAdmin: caller!.user.roles.includes('admin') });
  return { id: row.id, revokedAt: row.revokedAt };
});
