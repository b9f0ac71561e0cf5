import type { Metadata } from 'next';
import { Logo } from '@/components/ui/logo';
import { SignInForm } from './sign-in-form';
import { companyProviderConfigured } from '@/lib/auth/company';

export const dynamic = 'force-dynamic';

export const metadata: Metadata = { title: 'Sign in' };

export default function SignInPage() {
  return (
    <main className="flex min-h-screen items-center justify-center px-4">
      <div className="w-full max-w-sm">
        <div className="mb-6 flex flex-col items-center gap-2">
          <Logo size={40} />
          <p className="text-center text-sm text-ink-soft">The governed library of heat-transfer and flow correlations</p>
        </div>
        <SignInForm company={companyProviderConfigured()} />
      </div>
    </main>
  );
}
