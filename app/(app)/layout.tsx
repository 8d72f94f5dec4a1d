import Link from 'next/link';
import { requirePageUser } from '@/lib/auth/session';
import { QuietfixMark } from '@/components/brand/quietfix-mark';
import { SignOutButton } from '@/components/sign-out-button';
import type { Role } from '@/db/types';
import { env } from '@/lib/env';
import { MapSettingsProvider } from '@/components/map/map-settings';
import { mayLoadPlaces } from '@/lib/places/places-roles';

const NAV: { href: string; label: string; roles: Role[] }[] = [
  { href: '/cases', label: 'Cases', roles: ['admin', 'coordinator', 'hunter', 'member'] },
  { href: '/reports/new', label: 'Report noise', roles: ['admin', 'coordinator', 'hunter', 'member'] },
  { href: '/profile', label: 'Profile', roles: ['admin', 'coordinator', 'hunter', 'member'] },
  { href: '/invite', label: 'Invite', roles: ['admin', 'coordinator'] },
  { href: '/admin/users', label: 'People', roles: ['admin'] },
  { href: '/admin/mail', label: 'Caught mail', roles: ['admin'] },
  { href: '/admin/templates', label: 'Letters', roles: ['admin'] },
  { href: '/admin/settings', label: 'Club settings', roles: ['admin'] },
];

/** The main navigation; the phone menu and the wide-screen row differ only in layout. */
function MainNav({ links, className, linkClassName }: { links: typeof NAV; className: string; linkClassName: string }) {
  return (
    <nav aria-label="Main" className={className}>
      {links.map((n) => (
        <Link key={n.href} href={n.href} className={`rounded-md px-3 font-semibold text-ink hover:bg-hush-50 hover:no-underline ${linkClassName}`}>
          {n.label}
        </Link>
      ))}
    </nav>
  );
}

export default async function SignedInLayout({ children }: { children: React.ReactNode }) {
  const user = await requirePageUser();
  const links = NAV.filter((n) => n.roles.includes(user.role));
  return (
    <div className="flex min-h-dvh flex-col">
      <header className="sticky top-0 z-[1000] border-b border-ink/10 bg-white">
        <div className="mx-auto flex max-w-6xl items-center gap-x-4 gap-y-2 px-3 py-1 sm:flex-wrap sm:py-2">
          <Link href="/cases" aria-label="Quietfix, cases" className="flex items-center gap-2 font-extrabold text-ink no-underline hover:no-underline">
            <QuietfixMark className="h-7 w-7" />
            <span className="hidden sm:inline">Quietfix</span>
          </Link>
          {/* Phones: one line (the mark, a menu, sign out); wider screens: the links in a row. */}
          <details className="nav-menu relative flex-1 sm:hidden">
            <summary className="inline-flex min-h-12 cursor-pointer list-none items-center rounded-md px-3 font-semibold text-ink hover:bg-hush-50" data-testid="nav-menu">
              Menu
            </summary>
            <MainNav links={links} className="absolute left-0 z-[1100] mt-1 flex w-56 flex-col rounded-lg border border-ink/15 bg-white p-1 shadow-lg" linkClassName="flex min-h-12 items-center" />
          </details>
          <MainNav links={links} className="hidden flex-1 flex-wrap gap-1 sm:flex" linkClassName="py-2 text-sm" />
          <div className="flex items-center gap-2 text-sm">
            <span className="hidden text-ink-soft sm:inline" data-testid="who">
              {user.name} · {user.role}
            </span>
            <SignOutButton />
          </div>
        </div>
      </header>
      <main className="mx-auto w-full max-w-6xl flex-1 px-3 py-4 sm:px-4">
        {/* Tiles are configured at run time: the server reads them and hands them to the maps. */}
        <MapSettingsProvider settings={{ tileUrl: env.TILE_URL, tileAttribution: env.TILE_ATTRIBUTION, places: mayLoadPlaces(user.role), tilePrefetchMax: env.TILE_PREFETCH_MAX }}>{children}</MapSettingsProvider>
      </main>
    </div>
  );
}
