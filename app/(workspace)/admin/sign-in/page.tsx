import type { Metadata } from 'next';
import { SignInSettingsForm } from './sign-in-settings-form';

export const metadata: Metadata = { title: 'Company sign-in' };

export default function SignInSettingsPage() {
  return <SignInSettingsForm />;
}
