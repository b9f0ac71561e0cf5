import { route } from '@/lib/http/handler';
import { idParam, memberBody } from '@/lib/api/contract';
import { setProjectMember } from '@/lib/calculations/projects';

/** Adds, changes or (role null) removes a member. People only: membership is not for scripts. */
export const POST = route('POST /api/projects/{id}/members', { params: idParam, body: memberBody }, async ({ caller, params, body }) =>
  setProjectMember({ actor: caller!.user, projectId: params.id, email: body.email, role: body.role }));
