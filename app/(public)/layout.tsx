import Link from 'next/link';
import { Wordmark } from '@/components/brand/quietfix-mark';

export default function PublicLayout({ children }: { children: React.ReactNode }) {
  return (
    <div className="flex min-h-dvh flex-col">
      <header className="border-b border-ink/10 bg-white">
        <div className="mx-auto flex max-w-5xl items-center justify-between gap-3 px-4 py-3">
          <Link href="/" className="no-underline hover:no-underline" aria-label="Quietfix home">
            <Wordmark />
          </Link>
          <nav className="flex items-center gap-3 text-sm font-semibold">
            <Link href="/cautions">Cautions</Link>
            <Link href="/sign-in" className="btn-primary">
              Sign in
            </Link>
          </nav>
        </div>
      </header>
      <main className="mx-auto w-full max-w-5xl flex-1 px-4 py-8">{children}</main>
      <footer className="border-t border-ink/10 py-4 text-center text-sm text-ink-faint">
        Quietfix — quieter bands, one polite fix at a time.
      </footer>
    </div>
  );
}
