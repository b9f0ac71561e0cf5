import 'server-only';
import { getServerSession } from 'next-auth';
import { redirect } from 'next/navigation';
import { authOptions } from './options';
import { findUserById, toAuthUser, type AuthUser } from './users';
import type { Role } from '@/models';

/** For server components: the signed-in user (fresh from the database), or a redirect to sign in. */
export async function requireUser(): Promise<AuthUser> {
  const session = await getServerSession(authOptions);
  const user = session?.user?.id ? await findUserById({ id: session.user.id }) : null;
  if (!user || !user.isActive || user.sessionVersion !== (session?.user.sv ?? 0)) redirect('/sign-in');
  return toAuthUser(user);
}

/** Like requireUser, but also demands one of the roles; otherwise the forbidden page. */
export async function requireRole(roles: Role[]): Promise<AuthUser> {
  const user = await requireUser();
  if (!roles.some((r) => user.roles.includes(r))) redirect(`/forbidden?needs=${roles.join(',')}`);
  return user;
}
