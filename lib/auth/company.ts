import { randomBytes } from 'node:crypto';
import { z } from 'zod';
import { db, ROLES, type Role } from '@/models';
import { AppError } from '@/lib/http/errors';
import { appendAuditEvent } from '@/lib/audit/log';
import { forgetCachedTokensOfUser } from '@/lib/api/tokens';
import { readSetting, saveSetting } from '@/lib/db/settings';
import { hashPassword } from './passwords';
import { setRoles, type AuthUser } from './users';

/**
 * Company sign-in over OpenID Connect: roles come from the provider's group claims through a mapping an admin
 * edits (group → role), applied at every sign-in, so leaving a group loses the role at the next sign-in. Password
 * sign-in can be switched off, except for the break-glass admin (BREAK_GLASS_EMAIL, default admin@demo.example).
 */
const KEY = 'company-sign-in';

export const companySettingsSchema = z.object({
  passwordSignIn: z.boolean(),
  groupRoles: z.array(z.object({
    group: z.string().trim().min(1, 'Name the group').max(190, 'At most 190 characters').regex(/^[^\s,]+$/, 'A group name has no spaces or commas'),
    role: z.enum(ROLES),
  })).max(200, 'At most 200 mappings'),
});
export type CompanySettings = z.infer<typeof companySettingsSchema>;

const DEFAULTS: CompanySettings = { passwordSignIn: true, groupRoles: [] };

export function companyProviderConfigured(): boolean {
  return Boolean(process.env.OIDC_ISSUER && process.env.OIDC_CLIENT_ID && process.env.OIDC_CLIENT_SECRET);
}

export function breakGlassEmail(): string {
  return (process.env.BREAK_GLASS_EMAIL ?? 'admin@demo.example').trim().toLowerCase();
}

export async function companySettings(): Promise<CompanySettings> {
  const saved = await readSetting<Partial<CompanySettings>>(KEY);
  return saved ? { ...DEFAULTS, ...saved } : DEFAULTS;
}

export async function passwordSignInAllowed(email: string): Promise<boolean> {
  if (email.trim().toLowerCase() === breakGlassEmail()) return true;
  return (await companySettings()).passwordSignIn;
}

export async function setCompanySettings({ actor, settings }: { actor: AuthUser | null; settings: CompanySettings }): Promise<CompanySettings> {
  if (actor && !actor.roles.includes('admin')) throw new AppError('forbidden:role', 'Only an admin changes how people sign in.');
  const clean: CompanySettings = {
    passwordSignIn: settings.passwordSignIn,
    groupRoles: [...new Map(settings.groupRoles.map((m) => [`${m.group}|${m.role}`, { group: m.group.trim(), role: m.role }])).values()],
  };
  const before = await companySettings();
  await saveSetting({ key: KEY, value: clean, before, actorId: actor?.id ?? null, action: 'settings.sign-in-changed' });
  return clean;
}

/** The roles a set of groups maps to, sorted. */
export function rolesOfGroups(groups: string[], mapping: CompanySettings['groupRoles']): Role[] {
  const mine = new Set(groups);
  return [...new Set(mapping.filter((m) => mine.has(m.group)).map((m) => m.role))].sort();
}

/**
 * A person signed in at the company's provider: found by their verified e-mail (or created), their roles set to
 * what their groups map to now. Someone whose groups map to no role, or whose account here is deactivated, is refused.
 */
export async function signInWithCompanyAccount({ email, emailVerified, name, groups }: { email: string; emailVerified: boolean; name: string; groups: string[] }): Promise<AuthUser & { sessionVersion: number }> {
  const address = email.trim().toLowerCase();
  if (!address || !emailVerified) throw new AppError('forbidden:company-email', 'Your company account has no verified e-mail address; Correlary cannot tell who you are.');
  // A provider's answer is bounded like any input: at most 500 groups of at most 190 characters are looked at.
  groups = groups.filter((g) => typeof g === 'string' && g.length > 0 && g.length <= 190).slice(0, 500);
  const roles = rolesOfGroups(groups, (await companySettings()).groupRoles);
  if (!roles.length) throw new AppError('forbidden:no-role', 'Your company account is in no group that Correlary gives a role to; ask a Correlary admin.');
  const { sequelize, User, UserRole } = db();
  const unusable = await hashPassword(randomBytes(32).toString('base64url'));
  const result = await sequelize.transaction(async (transaction) => {
    let user = await User.findOne({ where: { email: address }, include: [{ model: UserRole, as: 'roles' }], transaction, lock: transaction.LOCK.UPDATE });
    if (user && !user.isActive) throw new AppError('forbidden:inactive', 'Your Correlary account is deactivated; ask a Correlary admin.');
    const before = user ? user.roleNames() : null;
    if (!user) {
      user = await User.create({ email: address, name: name.slice(0, 120) || address, passwordHash: unusable, lockedUntil: null }, { transaction });
      await appendAuditEvent({ transaction, event: { actorId: null, action: 'user.created', entityType: 'user', entityId: String(user.id), details: { email: address, roles, via: 'company sign-in' } } });
    }
    await setRoles(user.id, roles, transaction);
    if (before && before.join() !== roles.join()) {
      // Sessions with the old roles end; this sign-in's session starts with the new number.
      await User.increment('sessionVersion', { by: 1, where: { id: user.id }, transaction });
      await appendAuditEvent({ transaction, event: { actorId: null, action: 'user.roles-changed', entityType: 'user', entityId: String(user.id), details: { before: { roles: before }, after: { roles }, via: 'company groups', groups } } });
    }
    await appendAuditEvent({ transaction, event: { actorId: user.id, action: 'user.signed-in', entityType: 'user', entityId: String(user.id), details: { via: 'company account', groups, roles } } });
    const fresh = await User.findByPk(user.id, { transaction });
    return { id: user.id, email: address, name: user.name, roles, sessionVersion: fresh!.sessionVersion };
  });
  forgetCachedTokensOfUser(result.id);
  return result;
}
