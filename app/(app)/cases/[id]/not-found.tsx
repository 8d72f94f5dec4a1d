import Link from 'next/link';

export default function CaseNotFound() {
  return (
    <div className="card max-w-lg space-y-3">
      <h1 className="text-xl font-bold">No such case</h1>
      <p className="text-ink-soft">This case does not exist, or the link is incomplete.</p>
      <Link href="/cases" className="btn-primary">
        Back to the cases
      </Link>
    </div>
  );
}
