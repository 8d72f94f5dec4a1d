import type { Role } from '@/db/types';

declare module 'next-auth' {
  interface Session {
    user: { id: string; role: Role; name: string; email: string };
  }
  interface User {
    id: string;
    role: Role;
  }
}

declare module 'next-auth/jwt' {
  interface JWT {
    uid?: string;
    role?: Role;
  }
}
