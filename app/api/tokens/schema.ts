import { z } from 'zod';
import { TOKEN_SCOPES } from '@/lib/api/tokens';

export const createTokenBody = z.object({
  name: z.string().trim().min(1, 'Give the token a name').max(100, 'Name is too long (100 characters at most)'),
  scopes: z.array(z.enum(TOKEN_SCOPES)).min(1, 'Choose at least one scope'),
  expiresInDays: z.number().int().min(1, 'At least 1 day').max(730, 'At most 730 days').nullable().optional(),
  /** Admins may create a token for another user. */
  userId: z.number().int().positive().optional(),
}).strict();

export const tokenIdParams = z.object({ id: z.coerce.number().int().positive() });
export const listTokensQuery = z.object({ all: z.enum(['1', '0']).optional() });
