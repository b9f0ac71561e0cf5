import Link from 'next/link';
import { Logo } from '@/components/ui/logo';

/** Correlary's own "not found" page. */
export default function NotFound() {
  return (
    <main className="mx-auto flex min-h-screen max-w-xl flex-col justify-center gap-4 px-6">
      <Logo />
      <h1 className="text-2xl font-semibold">Nothing here</h1>
      <p className="text-ink-soft">This page does not exist, or the correlation, version or calculation it named is not one you can see.</p>
      <p className="flex gap-3 text-sm">
        <Link className="btn-primary" href="/library">Open the library</Link>
        <Link className="btn-quiet" href="/projects">Calculations</Link>
      </p>
    </main>
  );
}
