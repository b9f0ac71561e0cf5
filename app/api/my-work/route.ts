import { route } from '@/lib/http/handler';
import { authorWork } from '@/lib/governance/queries';

export const GET = route({ access: { roles: ['author'] } }, async ({ caller }) => ({ items: await authorWork({ actor: caller!.user }) }));
