import type { NextAuthOptions } from 'next-auth';
import CredentialsProvider from 'next-auth/providers/credentials';
import type { OAuthConfig } from 'next-auth/providers/oauth';
import { authenticate, endSessions } from './users';
import { companyProviderConfigured, signInWithCompanyAccount } from './company';

/**
 * The client's address for the sign-in throttle: the last X-Forwarded-For entry (the one added by the
 * server or proxy nearest to us; earlier entries are the client's own claims), else X-Real-IP.
 */
export function clientAddress(headers: Record<string, unknown>): string {
  const get = (k: string) => { const v = headers[k] ?? headers[k.toLowerCase()]; return Array.isArray(v) ? String(v[v.length - 1]) : typeof v === 'string' ? v : ''; };
  const forwarded = get('x-forwarded-for').split(',').map((x) => x.trim()).filter(Boolean);
  return forwarded.at(-1) || get('x-real-ip') || 'unknown';
}
import { AppError } from '@/lib/http/errors';

interface CompanyProfile { sub: string; email?: string; email_verified?: boolean; name?: string; groups?: string[] }

/**
 * The company's OpenID Connect provider (OIDC_ISSUER, OIDC_CLIENT_ID, OIDC_CLIENT_SECRET): the demo and tests run a
 * local stand-in (scripts/fake-oidc.ts); production points these at the real provider, which must send a `groups`
 * claim in the ID token. Code flow with PKCE and state.
 */
function companyProvider(): OAuthConfig<CompanyProfile>[] {
  if (!companyProviderConfigured()) return [];
  const issuer = process.env.OIDC_ISSUER!.replace(/\/$/, '');
  return [{
    id: 'company', name: 'your company account', type: 'oauth',
    wellKnown: `${issuer}/.well-known/openid-configuration`,
    clientId: process.env.OIDC_CLIENT_ID, clientSecret: process.env.OIDC_CLIENT_SECRET,
    authorization: { params: { scope: 'openid email profile groups' } },
    idToken: true, checks: ['pkce', 'state'],
    profile: (p) => ({ id: p.sub, email: p.email ?? null, name: p.name ?? p.email ?? p.sub }),
  }];
}

export const authOptions: NextAuthOptions = {
  session: { strategy: 'jwt', maxAge: 8 * 60 * 60 },
  pages: { signIn: '/sign-in' },
  providers: [
    CredentialsProvider({
      name: 'E-mail and password',
      credentials: { email: { label: 'E-mail', type: 'email' }, password: { label: 'Password', type: 'password' } },
      async authorize(credentials, req) {
        const email = credentials?.email?.trim() ?? '';
        const password = credentials?.password ?? '';
        if (!email || !password) throw new Error('Enter your e-mail and password.');
        if (email.length > 190 || password.length > 128) throw new Error('E-mail or password is too long.');
        try {
          const user = await authenticate({ email, password, client: clientAddress(req?.headers ?? {}) });
          return { id: String(user.id), email: user.email, name: user.name, roles: user.roles, sv: user.sessionVersion };
        } catch (err) {
          if (err instanceof AppError) throw new Error(err.message);
          console.error('sign-in failed', err);
          throw new Error('Sign-in is unavailable just now; please try again.');
        }
      },
    }),
    ...companyProvider(),
  ],
  callbacks: {
    /** A company sign-in: the person is found or created and given the roles their groups map to now. */
    async signIn({ user, account, profile }) {
      if (account?.provider !== 'company') return true;
      const p = (profile ?? {}) as CompanyProfile;
      try {
        const u = await signInWithCompanyAccount({ email: p.email ?? '', emailVerified: p.email_verified !== false, name: p.name ?? '', groups: Array.isArray(p.groups) ? p.groups.map(String) : [] });
        Object.assign(user, { id: String(u.id), email: u.email, name: u.name, roles: u.roles, sv: u.sessionVersion });
        return true;
      } catch (err) {
        if (err instanceof AppError) return `/sign-in?company=${encodeURIComponent(err.code)}`;
        console.error('company sign-in failed', err);
        return '/sign-in?company=unavailable';
      }
    },
    async jwt({ token, user, account }) {
      if (user) {
        token.via = account?.provider === 'company' ? 'company' : 'password';
        token.authAt = Math.floor(Date.now() / 1000);
        token.uid = Number(user.id);
        token.roles = (user as { roles?: string[] }).roles ?? [];
        token.sv = (user as { sv?: number }).sv ?? 0;
      }
      return token;
    },
    async session({ session, token }) {
      session.user = { ...session.user, id: token.uid as number, roles: (token.roles as string[]) ?? [], sv: token.sv ?? 0, via: token.via ?? 'password', authAt: token.authAt ?? 0 };
      return session;
    },
  },
  events: {
    // A session is a signed cookie, valid until it expires: signing out ends every session of the
    // account (its session number moves on), so a copied cookie dies with the sign-out too.
    async signOut({ token }) {
      if (token?.uid) await endSessions({ userId: Number(token.uid) });
    },
  },
};
