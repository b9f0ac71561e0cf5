import { route } from '@/lib/http/handler';
import { createProjectBody } from '@/lib/api/contract';
import { createProject, listProjects } from '@/lib/calculations/projects';

export const GET = route('GET /api/projects', {}, async ({ caller }) => ({ items: await listProjects({ actor: caller!.user }) }));

export const POST = route('POST /api/projects', { body: createProjectBody }, async ({ caller, body }) =>
  createProject({ actor: caller!.user, name: body.name, description: body.description }));
