import Link from 'next/link';

export default async function ForbiddenPage({ searchParams }: { searchParams: Promise<{ needs?: string }> }) {
  const { needs } = await searchParams;
  return (
    <div className="panel mx-auto max-w-lg space-y-2">
      <h1 className="text-lg font-semibold">Not available with your roles</h1>
      <p className="text-sm text-ink-soft">
        This page needs {needs ? <>one of the roles <strong>{needs.split(',').join(', ')}</strong></> : 'another role'}.
        Ask an administrator if you need it.
      </p>
      <Link href="/library" className="btn-quiet">Back to the library</Link>
    </div>
  );
}
