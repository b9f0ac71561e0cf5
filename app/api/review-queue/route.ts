import { route } from '@/lib/http/handler';
import { reviewQueue } from '@/lib/governance/queries';

export const GET = route('GET /api/review-queue', {}, async ({ caller }) => ({ items: await reviewQueue({ actor: caller!.user }) }));
