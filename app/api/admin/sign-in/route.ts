import { route } from '@/lib/http/handler';
import { breakGlassEmail, companyProviderConfigured, companySettings, companySettingsSchema, setCompanySettings } from '@/lib/auth/company';

/** How people sign in: the company provider's group → role mapping and whether passwords are accepted (admins, in person). */
export const GET = route('GET /api/admin/sign-in', {}, async () => ({
  ...(await companySettings()), providerConfigured: companyProviderConfigured(), issuer: process.env.OIDC_ISSUER ?? null, breakGlassEmail: breakGlassEmail(),
}));

export const PUT = route('PUT /api/admin/sign-in', { body: companySettingsSchema }, async ({ caller, body }) =>
  setCompanySettings({ actor: caller!.user, settings: body }));
