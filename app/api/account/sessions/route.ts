import { route } from '@/lib/http/handler';
import { endSessions } from '@/lib/auth/users';
import { appendAuditEvent } from '@/lib/audit/log';
import { db } from '@/models';

/** Sign out everywhere: every session of the caller ends, this one included. */
export const DELETE = route('DELETE /api/account/sessions', {}, async ({ caller }) => {
  await db().sequelize.transaction(async (transaction) => {
    await endSessions({ userId: caller!.user.id, transaction });
    await appendAuditEvent({ transaction, event: { actorId: caller!.user.id, action: 'user.sessions-ended', entityType: 'user', entityId: String(caller!.user.id) } });
  });
  return { ended: true };
});
