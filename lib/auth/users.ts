import { Op, type Transaction } from 'sequelize';
import { forgetCachedTokensOfUser } from '@/lib/api/tokens';
import { z } from 'zod';
import { db, ROLES, type Role, type User } from '@/models';
import { AppError } from '@/lib/http/errors';
import { appendAuditEvent } from '@/lib/audit/log';
import { assertNotThrottled, clearFailures, personBuckets, recordFailure, signInBuckets, throttledCheck } from './throttle';
import { hashPassword, verifyPassword, PASSWORD_MAX, PASSWORD_MIN } from './passwords';
import { passwordSignInAllowed } from './company';


let dummy: Promise<string> | undefined;
const dummyHash = () => (dummy ??= hashPassword('correlary-timing-equaliser'));

export interface AuthUser {
  id: number;
  email: string;
  name: string;
  roles: Role[];
  /** A session caller's sign-in: how and when (Unix seconds). A company account signs by signing in afresh. */
  session?: { via: 'password' | 'company'; authAt: number };
}

export function toAuthUser(u: User): AuthUser {
  return { id: u.id, email: u.email, name: u.name, roles: u.roleNames() };
}

export const emailSchema = z.string().trim().toLowerCase().min(3, 'Enter an e-mail address')
  .max(190, 'E-mail address is too long (190 characters at most)').email('Enter a valid e-mail address');
export const passwordSchema = z.string()
  .min(PASSWORD_MIN, `Password must have at least ${PASSWORD_MIN} characters`)
  .max(PASSWORD_MAX, `Password must have at most ${PASSWORD_MAX} characters`);
export const rolesSchema = z.array(z.enum(ROLES)).min(1, 'Choose at least one role');

export async function findUserById({ id }: { id: number }): Promise<User | null> {
  const { User, UserRole } = db();
  return User.findByPk(id, { include: [{ model: UserRole, as: 'roles' }] });
}

/**
 * Checks e-mail and password under the sign-in throttle (lib/auth/throttle.ts): wrong passwords slow
 * down their source instead of locking the account. Unknown accounts, inactive ones and wrong
 * passwords get the same answer after the same work (a password hash is always checked).
 */
export async function authenticate({ email, password, client }: { email: string; password: string; client: string }): Promise<AuthUser & { sessionVersion: number }> {
  const { User, UserRole } = db();
  const buckets = signInBuckets(email, client);
  await assertNotThrottled(buckets, 'this sign-in');
  if (!(await passwordSignInAllowed(email))) {
    throw new AppError('forbidden:password-sign-in-off', 'Password sign-in is switched off here; sign in with your company account.');
  }
  const user = await User.findOne({ where: { email: email.trim().toLowerCase() }, include: [{ model: UserRole, as: 'roles' }] });
  const ok = user?.isActive ? await verifyPassword(password, user.passwordHash) : (await verifyPassword(password, await dummyHash()), false);
  if (!ok || !user) {
    await recordFailure(buckets);
    throw new AppError('unauthenticated:credentials', 'E-mail or password is not correct.');
  }
  // The client address bucket keeps counting: one good account does not clear guessing at others.
  await clearFailures([buckets[0], buckets[2]]);
  return { ...toAuthUser(user), sessionVersion: user.sessionVersion };
}

/** Ends every session of a user (password change, sign-out everywhere, deactivation, role change). */
export async function endSessions({ userId, transaction }: { userId: number; transaction?: Transaction }) {
  const { User } = db();
  await User.increment('sessionVersion', { by: 1, where: { id: userId }, transaction });
}

export async function listUsers() {
  const { User, UserRole } = db();
  const users = await User.findAll({ include: [{ model: UserRole, as: 'roles' }], order: [['email', 'ASC']] });
  return users.map((u) => ({ ...toAuthUser(u), isActive: u.isActive, lockedUntil: u.lockedUntil, createdAt: u.createdAt }));
}

export async function setRoles(userId: number, roles: Role[], transaction: Transaction) {
  const { UserRole } = db();
  await UserRole.destroy({ where: { userId }, transaction });
  await UserRole.bulkCreate([...new Set(roles)].map((role) => ({ userId, role })), { transaction });
}

export async function createUser({ actorId, email, name, password, roles }: {
  actorId: number | null; email: string; name: string; password: string; roles: Role[];
}): Promise<AuthUser> {
  const { sequelize, User } = db();
  const passwordHash = await hashPassword(password);
  return sequelize.transaction(async (transaction) => {
    if (await User.findOne({ where: { email }, transaction })) {
      throw new AppError('conflict:user-email', `A user with the e-mail ${email} already exists.`, { issues: [{ path: 'email', message: 'This e-mail is already in use' }] });
    }
    const user = await User.create({ email, name, passwordHash, lockedUntil: null }, { transaction });
    await setRoles(user.id, roles, transaction);
    await appendAuditEvent({ transaction, event: { actorId, action: 'user.created', entityType: 'user', entityId: String(user.id), details: { email, roles } } });
    return { id: user.id, email, name, roles: [...new Set(roles)].sort() };
  });
}

export async function updateUser({ actorId, userId, roles, isActive, name }: {
  actorId: number; userId: number; roles?: Role[]; isActive?: boolean; name?: string;
}) {
  const { sequelize } = db();
  return sequelize.transaction(async (transaction) => {
    const user = await findUserById({ id: userId });
    if (!user) throw new AppError('not_found:user', `No user with id ${userId}.`);
    const before = { roles: user.roleNames(), isActive: user.isActive, name: user.name };
    if (userId === actorId && (isActive === false || (roles && !roles.includes('admin')))) {
      throw new AppError('conflict:self-lockout', 'You cannot deactivate yourself or remove your own admin role.');
    }
    if (roles) await setRoles(userId, roles, transaction);
    const patch: Partial<{ isActive: boolean; name: string }> = {};
    if (isActive !== undefined) patch.isActive = isActive;
    if (name !== undefined) patch.name = name;
    if (Object.keys(patch).length) await user.update(patch, { transaction });
    const rolesChanged = roles !== undefined && before.roles.join() !== [...new Set(roles)].sort().join();
    if (isActive === false || rolesChanged) await endSessions({ userId, transaction });
    // A deactivated person's tokens die with the account: reactivation never revives them.
    if (isActive === false && before.isActive) await db().ApiToken.update({ revokedAt: new Date() }, { where: { userId, revokedAt: null }, transaction });
    const after = { roles: roles ? [...new Set(roles)].sort() : before.roles, isActive: isActive ?? before.isActive, name: name ?? before.name };
    const action = roles && before.roles.join() !== after.roles.join() ? 'user.roles-changed' : 'user.updated';
    await appendAuditEvent({ transaction, event: { actorId, action, entityType: 'user', entityId: String(userId), details: { before, after } } });
    return after;
  }).finally(() => forgetCachedTokensOfUser(userId));
}

export async function changePassword({ userId, currentPassword, newPassword }: {
  userId: number; currentPassword: string; newPassword: string;
}) {
  const { sequelize } = db();
  const user = await findUserById({ id: userId });
  if (!user) throw new AppError('not_found:user', 'User not found.');
  if (!(await throttledCheck(personBuckets('password-change', userId), 'the password change', () => verifyPassword(currentPassword, user.passwordHash)))) {
    throw new AppError('invalid:password', 'The current password is not correct.', { issues: [{ path: 'currentPassword', message: 'Not correct' }] });
  }
  const passwordHash = await hashPassword(newPassword);
  await sequelize.transaction(async (transaction) => {
    await user.update({ passwordHash }, { transaction });
    await endSessions({ userId, transaction });
    await appendAuditEvent({ transaction, event: { actorId: userId, action: 'user.password-changed', entityType: 'user', entityId: String(userId) } });
  });
}

/** Approvers (active users holding the role), for notifications. */
export async function usersWithRole({ role }: { role: Role }) {
  const { User, UserRole } = db();
  return User.findAll({
    where: { isActive: true },
    include: [{ model: UserRole, as: 'roles', where: { role: { [Op.eq]: role } } }],
  });
}
