import { db, type Role } from '@/models';
import { findUserById, toAuthUser, type AuthUser } from '@/lib/auth/users';
import { hashPassword } from '@/lib/auth/passwords';
import { appendAuditEvent } from '@/lib/audit/log';

/** Demo-only password shared by every demo account (stated in the README; never use it in production). */
export const DEMO_PASSWORD = 'correlary-demo-2026';

/** Staff of the invented demo company, Brightwater Thermal Systems. */
export const DEMO_USERS: { email: string; name: string; roles: Role[] }[] = [
  { email: 'admin@demo.example', name: 'Ines Adler', roles: ['admin'] },
  { email: 'author@demo.example', name: 'Tomas Varga', roles: ['author', 'engineer'] },
  { email: 'approver@demo.example', name: 'Maren Holt', roles: ['approver', 'engineer'] },
  { email: 'approver2@demo.example', name: 'Kwame Osei', roles: ['approver', 'engineer'] },
  { email: 'engineer@demo.example', name: 'Lucia Ferraz', roles: ['engineer'] },
  { email: 'integrator@demo.example', name: 'Devi Raman', roles: ['integrator'] },
];

export const name = '20261201000100-demo-users';

/** A demo user as the services expect an actor; later seeders act through them. */
export async function demoActor(email: string): Promise<AuthUser> {
  const { User } = db();
  const u = await User.findOne({ where: { email } });
  const full = u && (await findUserById({ id: u.id }));
  if (!full) throw new Error(`seed needs the demo user ${email}`);
  return toAuthUser(full);
}

export async function up(): Promise<void> {
  const { sequelize, User, UserRole } = db();
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  await sequelize.transaction(async (transaction) => {
    for (const u of DEMO_USERS) {
      const [user, created] = await User.findOrCreate({
        where: { email: u.email }, defaults: { email: u.email, name: u.name, passwordHash, lockedUntil: null }, transaction,
      });
      if (!created) continue;
      await UserRole.bulkCreate(u.roles.map((role) => ({ userId: user.id, role })), { transaction });
      await appendAuditEvent({ transaction, event: { actorId: null, action: 'user.created', entityType: 'user', entityId: String(user.id), details: { email: u.email, roles: u.roles, by: 'demo seed' } } });
    }
  });
}

export async function down(): Promise<void> {
  const { User } = db();
  await User.destroy({ where: { email: DEMO_USERS.map((u) => u.email) } });
}
