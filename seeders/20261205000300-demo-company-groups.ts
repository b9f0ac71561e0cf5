import { QueryTypes } from 'sequelize';
import { db } from '@/models';
import { setCompanySettings } from '@/lib/auth/company';
import { readSetting } from '@/lib/db/settings';

export const name = '20261205000300-demo-company-groups';

/**
 * The invented company directory's groups (scripts/fake-oidc.ts) mapped to Correlary roles, so the demo's company
 * sign-in works at once. An admin edits the mapping on Administration → Company sign-in. Passwords stay on for the demo.
 */
export async function up(): Promise<void> {
  if (await readSetting('company-sign-in')) return;
  await setCompanySettings({ actor: null, settings: { passwordSignIn: true, groupRoles: [
    { group: 'thermal-methods', role: 'author' },
    { group: 'thermal-approvers', role: 'approver' },
    { group: 'thermal-engineers', role: 'engineer' },
    { group: 'it-integration', role: 'integrator' },
    { group: 'correlary-admins', role: 'admin' },
  ] } });
}

export async function down(): Promise<void> {
  await db().sequelize.query("DELETE FROM settings WHERE `key` = 'company-sign-in'", { type: QueryTypes.BULKDELETE });
}
