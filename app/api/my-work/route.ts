import { route } from '@/lib/http/handler';
import { authorWork } from '@/lib/governance/queries';

export const GET = route('GET /api/my-work', {}, async ({ caller }) => ({ items: await authorWork({ actor: caller!.user }) }));
