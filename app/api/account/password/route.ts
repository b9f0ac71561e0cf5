import { z } from 'zod';
import { route } from '@/lib/http/handler';
import { AppError } from '@/lib/http/errors';
import { changePassword, passwordSchema } from '@/lib/auth/users';

const body = z.object({
  currentPassword: z.string().min(1, 'Enter your current password').max(128),
  newPassword: passwordSchema,
}).strict();

export const POST = route('POST /api/account/password', { body }, async ({ caller, body }) => {
  if (caller!.via !== 'session') {
    throw new AppError('forbidden:session-only', 'Passwords can only be changed from a signed-in browser session.');
  }
  await changePassword({ userId: caller!.user.id, ...body });
  return { ok: true };
});
