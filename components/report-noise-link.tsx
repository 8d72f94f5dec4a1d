import Link from 'next/link';

/** The prominent way into a new noise report, for the signed-in shell. */
export function ReportNoiseLink({ className = '' }: { className?: string }) {
  return (
    <Link href="/reports/new" className={`btn-primary ${className}`} data-testid="report-noise-link">
      Report noise
    </Link>
  );
}
