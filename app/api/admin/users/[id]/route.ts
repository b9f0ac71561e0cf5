import { route } from '@/lib/http/handler';
import { updateUser } from '@/lib/auth/users';
import { updateUserBody, userIdParams } from '../schema';

export const PATCH = route('PATCH /api/admin/users/{id}', { params: userIdParams, body: updateUserBody },
  async ({ caller, params, body }) => updateUser({ actorId: caller!.user.id, userId: params.id, ...body }));
