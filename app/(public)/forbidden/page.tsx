import Link from 'next/link';

export default function Forbidden() {
  return (
    <div className="card max-w-lg space-y-3">
      <h1 className="text-2xl font-bold">Not for your role</h1>
      <p className="text-ink-soft">This page belongs to another role in the committee. Ask your club&apos;s admin if you need it.</p>
      <Link href="/cases" className="btn-quiet">
        Back to cases
      </Link>
    </div>
  );
}
