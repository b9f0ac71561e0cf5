import { route } from '@/lib/http/handler';
import { idParam } from '@/lib/api/contract';
import { getProject } from '@/lib/calculations/projects';

export const GET = route('GET /api/projects/{id}', { params: idParam }, async ({ caller, params }) => getProject({ actor: caller!.user, id: params.id }));
