import type { NextAuthOptions } from 'next-auth';
import CredentialsProvider from 'next-auth/providers/credentials';
import { authenticate } from './users';
import { AppError } from '@/lib/http/errors';

export const authOptions: NextAuthOptions = {
  session: { strategy: 'jwt', maxAge: 8 * 60 * 60 },
  pages: { signIn: '/sign-in' },
  providers: [
    CredentialsProvider({
      name: 'E-mail and password',
      credentials: { email: { label: 'E-mail', type: 'email' }, password: { label: 'Password', type: 'password' } },
      async authorize(credentials) {
        const email = credentials?.email?.trim() ?? '';
        const password = credentials?.password ?? '';
        if (!email || !password) throw new Error('Enter your e-mail and password.');
        if (email.length > 190 || password.length > 128) throw new Error('E-mail or password is too long.');
        try {
          const user = await authenticate({ email, password });
          return { id: String(user.id), email: user.email, name: user.name, roles: user.roles };
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
      }
      return token;
    },
    async session({ session, token }) {
      session.user = { ...session.user, id: token.uid as number, roles: (token.roles as string[]) ?? [] };
      return session;
    },
  },
};
