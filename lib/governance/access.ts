import type { AuthUser } from '@/lib/auth/users';
import type { CorrelationVersion, VersionStatus } from '@/models';

/** Statuses anyone signed in (or any token) may read. */
export const PUBLISHED: VersionStatus[] = ['approved', 'superseded', 'withdrawn'];

/** Drafts, versions in review and returned versions are seen only by their author and by approvers. */
export function canSeeVersion(actor: AuthUser | null, v: Pick<CorrelationVersion, 'status' | 'authorId'>): boolean {
  if (PUBLISHED.includes(v.status)) return true;
  if (!actor) return false;
  return v.authorId === actor.id || actor.roles.includes('approver');
}

export const MEANING_OF_APPROVAL = 'I reviewed the definition, references and validation report; approved for use.';
export const MEANING_OF_RETURN = 'I reviewed this version and returned it to its author for changes.';
export const MEANING_OF_WITHDRAWAL = 'I withdraw this version from use for the reason given.';
