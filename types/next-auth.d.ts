import 'next-auth';
import 'next-auth/jwt';

declare module 'next-auth' {
  interface Session {
    user: { id: number; roles: string[]; sv: number; via?: 'password' | 'company'; authAt?: number; name?: string | null; email?: string | null; image?: string | null };
  }
}

declare module 'next-auth/jwt' {
  interface JWT {
    uid?: number;
    roles?: string[];
    sv?: number;
    /** How the person signed in, and when (Unix seconds): a company-account signature is a fresh sign-in at the provider. */
    via?: 'password' | 'company';
    authAt?: number;
  }
}
