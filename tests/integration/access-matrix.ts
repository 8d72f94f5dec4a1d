/**
 * Who may call what: every route x signed-out and every role, with the expected status.
 * New routes add rows here; access.test.ts runs them all.
 */
export type Who = 'anon' | 'admin' | 'coordinator' | 'hunter' | 'member';
export type Row = {
  name: string;
  method: string;
  /** path, may use ids the test prepares (see access.test.ts) */
  path: (ids: Record<string, string>) => string;
  body?: (who: Who) => unknown;
  expect: Record<Who, number>;
};

const ALL_SIGNED_IN = { anon: 401, admin: 200, coordinator: 200, hunter: 200, member: 200 };
const ADMIN_ONLY = { anon: 401, admin: 200, coordinator: 403, hunter: 403, member: 403 };

export const ACCESS: Row[] = [
  { name: 'list cases', method: 'GET', path: () => '/api/cases', expect: ALL_SIGNED_IN },
  { name: 'list users', method: 'GET', path: () => '/api/users', expect: ADMIN_ONLY },
  { name: 'change a user', method: 'PATCH', path: (ids) => `/api/users/${ids.member}`, body: () => ({ role: 'member' }), expect: ADMIN_ONLY },
  {
    name: 'invite',
    method: 'POST',
    path: () => '/api/invitations',
    body: (who) => ({ email: `matrix-${who}-${Date.now()}@example.test`, name: 'Matrix Person', role: 'member' }),
    expect: { anon: 401, admin: 201, coordinator: 201, hunter: 403, member: 403 },
  },
  { name: 'caught mail', method: 'GET', path: () => '/api/mail/messages', expect: ADMIN_ONLY },
  {
    name: 'compute a fix',
    method: 'POST',
    path: () => '/api/df/fix',
    body: () => ({
      lines: [
        { lat: -31.06, lon: 129.74, azimuthDeg: 30 },
        { lat: -31.06, lon: 129.76, azimuthDeg: 330 },
      ],
    }),
    expect: ALL_SIGNED_IN,
  },
];
