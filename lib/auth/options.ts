import type { NextAuthOptions } from 'next-auth';
import CredentialsProvider from 'next-auth/providers/credentials';
import { authenticate, endSessions } from './users';

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
  ],
  callbacks: {
    async jwt({ token, user }) {
      if (user) {
        token.uid = Number(user.id);
        token.roles = (user as { roles?: string[] }).roles ?? [];
        token.sv = (user as { sv?: number }).sv ?? 0;
      }
      return token;
    },
    async session({ session, token }) {
      session.user = { ...session.user, id: token.uid as number, roles: (token.roles as string[]) ?? [], sv: token.sv ?? 0 };
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
