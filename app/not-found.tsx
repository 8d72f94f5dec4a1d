import Link from 'next/link';

export default function NotFound() {
  return (
    <main className="mx-auto max-w-lg p-8">
      <div className="card space-y-3">
        <h1 className="text-2xl font-bold">Nothing here</h1>
        <p className="text-ink-soft">The page you asked for does not exist, or the link has expired.</p>
        <Link href="/" className="btn-quiet">
          Quietfix home
        </Link>
      </div>
    </main>
  );
}
