import type { Role } from '@/db/types';

declare module 'next-auth' {
  interface Session {
    /** sessionVersion: the account's session version at sign-in (lib/auth/session.ts refuses an older one). */
    user: { id: string; role: Role; name: string; email: string; sessionVersion: number };
  }
  interface User {
    id: string;
    role: Role;
    sessionVersion: number;
  }
}

declare module 'next-auth/jwt' {
  interface JWT {
    uid?: string;
    role?: Role;
    /** the account's session version when this session began */
    sv?: number;
  }
}
