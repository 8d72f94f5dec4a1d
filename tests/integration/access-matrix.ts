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
  /** the content type of a successful answer when it is not JSON (e.g. the letter PDF) */
  contentType?: RegExp;
  /** keys that must appear nowhere in these callers' answers (checked at any depth) */
  hidden?: { from: Who[]; keys: string[] };
  /** the route reads a body that is not JSON (a CSV upload: `route({ body: 'raw' })`); a string body is sent as it is */
  rawBody?: boolean;
};

const ALL_SIGNED_IN = { anon: 401, admin: 200, coordinator: 200, hunter: 200, member: 200 };
const ADMIN_ONLY = { anon: 401, admin: 200, coordinator: 403, hunter: 403, member: 403 };
/** Signed in and allowed, then stopped by validation: proves the access check came first. */
const ALL_SIGNED_IN_BAD_BODY = { anon: 401, admin: 400, coordinator: 400, hunter: 400, member: 400 };
const HUNT_READ = { anon: 401, admin: 200, coordinator: 200, hunter: 200, member: 403 };
const HUNT_WRITE_BAD_BODY = { anon: 401, admin: 400, coordinator: 400, hunter: 400, member: 403 };
const COMMITTEE_BAD_BODY = { anon: 401, admin: 400, coordinator: 400, hunter: 403, member: 403 };
const COMMITTEE_READ = { anon: 401, admin: 200, coordinator: 200, hunter: 403, member: 403 };
/** Allowed to look, and the thing looked for does not exist. */
const ALL_SIGNED_IN_NOT_FOUND = { anon: 401, admin: 404, coordinator: 404, hunter: 404, member: 404 };
/** Public routes (no session needed): everyone, signed in or not, gets the same answer. */
const EVERYONE = (status: number) => ({ anon: status, admin: status, coordinator: status, hunter: status, member: status });
const NO_FILE = '00000000-0000-4000-8000-00000000f11e';
/** A household's details and the other-case warning: the committee's only (the hunter sees a notice exists and its status). */
const RECIPIENT_DETAILS = { from: ['hunter'] as Who[], keys: ['recipientName', 'postalAddress', 'email', 'personalNote', 'answers', 'delivery', 'sameAddressElsewhere', 'responseLink', 'link'] };

export const ACCESS: Row[] = [
  { name: 'list cases', method: 'GET', path: () => '/api/cases', expect: ALL_SIGNED_IN },
  // The committee's week (issue 13): queue, map, statistics, saved views, bulk assignment.
  { name: 'queue page by keyset', method: 'GET', path: () => '/api/cases?sort=stateAge&dir=desc&status=open&pageSize=5', expect: ALL_SIGNED_IN },
  { name: 'map of cases', method: 'GET', path: () => '/api/cases/map?bbox=129.6,-31.2,129.9,-30.9&zoom=12', expect: ALL_SIGNED_IN },
  { name: 'statistics', method: 'GET', path: () => '/api/stats', expect: COMMITTEE_READ },
  { name: 'saved views', method: 'GET', path: () => '/api/saved-filters', expect: ALL_SIGNED_IN },
  { name: 'save a view', method: 'POST', path: () => '/api/saved-filters', body: () => ({}), expect: ALL_SIGNED_IN_BAD_BODY },
  { name: 'remove a view', method: 'DELETE', path: () => '/api/saved-filters/00000000-0000-4000-8000-000000000000', expect: { anon: 401, admin: 404, coordinator: 404, hunter: 404, member: 404 } },
  { name: 'bulk assign', method: 'POST', path: () => '/api/cases/bulk-assign', body: () => ({}), expect: COMMITTEE_BAD_BODY },
  { name: 'export a case', method: 'GET', path: (ids) => `/api/cases/${ids.openCase}/export?format=geojson`, expect: HUNT_READ, contentType: /application\/geo\+json/ },
  { name: 'export the filtered cases', method: 'GET', path: () => '/api/cases/export?format=csv&status=open', expect: COMMITTEE_READ, contentType: /text\/csv/ },
  { name: 'case dossier', method: 'GET', path: (ids) => `/api/cases/${ids.openCase}/dossier.pdf`, expect: COMMITTEE_READ, contentType: /application\/pdf/ },
  { name: 'club export', method: 'GET', path: () => '/api/club/export', expect: ADMIN_ONLY, contentType: /application\/zip/ },
  { name: 'club settings', method: 'GET', path: () => '/api/settings', expect: ADMIN_ONLY },
  { name: 'change club settings', method: 'PATCH', path: () => '/api/settings', body: () => ({}), expect: ADMIN_ONLY },
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
  { name: 'change own password', method: 'POST', path: () => '/api/password/change', body: () => ({}), expect: ALL_SIGNED_IN_BAD_BODY },
  // The signed-out account routes. A bad address is refused before the reset limit counts it, so
  // these rows spend none of the per-client allowance the account tests measure.
  { name: 'ask for a reset link', method: 'POST', path: () => '/api/password/forgot', body: () => ({ email: 'not an address' }), expect: EVERYONE(400) },
  { name: 'set a password from a link', method: 'POST', path: () => '/api/password', body: () => ({ token: 'x'.repeat(43), password: 'a long password', confirm: 'a long password' }), expect: EVERYONE(404) },
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
  // The hunt. `openCase` is the demo's open case: reported by the demo member, assigned to the demo hunter.
  { name: 'file a report', method: 'POST', path: () => '/api/cases', body: () => ({}), expect: ALL_SIGNED_IN_BAD_BODY },
  { name: 'read a case', method: 'GET', path: (ids) => `/api/cases/${ids.openCase}`, expect: ALL_SIGNED_IN },
  { name: 'edit or assign a case', method: 'PATCH', path: (ids) => `/api/cases/${ids.openCase}`, body: () => ({ version: 1, title: 'x' }), expect: COMMITTEE_BAD_BODY },
  { name: 'change status', method: 'POST', path: (ids) => `/api/cases/${ids.openCase}/transitions`, body: () => ({}), expect: HUNT_WRITE_BAD_BODY },
  { name: 'list bearings', method: 'GET', path: (ids) => `/api/cases/${ids.openCase}/bearings`, expect: HUNT_READ },
  { name: 'add a bearing', method: 'POST', path: (ids) => `/api/cases/${ids.openCase}/bearings`, body: () => ({}), expect: HUNT_WRITE_BAD_BODY },
  { name: 'edit a bearing', method: 'PATCH', path: (ids) => `/api/cases/${ids.openCase}/bearings/${ids.openBearing}`, body: () => ({}), expect: HUNT_WRITE_BAD_BODY },
  {
    // A CSV body; the header lacks the required columns, so an allowed caller gets the 400 that lists them.
    name: 'import bearings from CSV',
    method: 'POST',
    path: (ids) => `/api/cases/${ids.openCase}/bearings/import`,
    body: () => 'not,a,bearings,file\n1,2,3,4\n',
    rawBody: true,
    expect: HUNT_WRITE_BAD_BODY,
  },
  { name: 'add a sweep', method: 'POST', path: (ids) => `/api/cases/${ids.openCase}/sweeps`, body: () => ({}), expect: HUNT_WRITE_BAD_BODY },
  { name: 'read the fix', method: 'GET', path: (ids) => `/api/cases/${ids.openCase}/fix`, expect: HUNT_READ },
  { name: 'list level readings', method: 'GET', path: (ids) => `/api/cases/${ids.openCase}/readings`, expect: HUNT_READ },
  { name: 'add a level reading', method: 'POST', path: (ids) => `/api/cases/${ids.openCase}/readings`, body: () => ({}), expect: HUNT_WRITE_BAD_BODY },
  { name: 'read the timeline', method: 'GET', path: (ids) => `/api/cases/${ids.openCase}/events`, expect: ALL_SIGNED_IN },
  { name: 'comment', method: 'POST', path: (ids) => `/api/cases/${ids.openCase}/comments`, body: () => ({ text: '' }), expect: ALL_SIGNED_IN_BAD_BODY },
  { name: 'merge', method: 'POST', path: (ids) => `/api/cases/${ids.openCase}/merge`, body: () => ({}), expect: COMMITTEE_BAD_BODY },
  // From a fix to a door: places are map data for hunters and the committee; a case's candidate
  // houses and premises (personal data) for the committee and the assigned hunter.
  { name: 'places in a box', method: 'GET', path: () => '/api/places?bbox=129.745,-31.054,129.755,-31.048', expect: HUNT_READ },
  { name: 'candidate houses', method: 'GET', path: (ids) => `/api/cases/${ids.openCase}/candidates`, expect: HUNT_READ },
  { name: 'read the premises', method: 'GET', path: (ids) => `/api/cases/${ids.openCase}/premises`, expect: HUNT_READ },
  { name: 'confirm the premises', method: 'PUT', path: (ids) => `/api/cases/${ids.openCase}/premises`, body: () => ({}), expect: HUNT_WRITE_BAD_BODY },
  // Evidence files follow the case: whoever sees it sees its files and may add some (files.test.ts
  // covers deletion by the uploader or the committee, and the stripped photo copy).
  { name: 'list files', method: 'GET', path: (ids) => `/api/cases/${ids.openCase}/files`, expect: ALL_SIGNED_IN },
  { name: 'ask to upload a file', method: 'POST', path: (ids) => `/api/cases/${ids.openCase}/files`, body: () => ({}), expect: ALL_SIGNED_IN_BAD_BODY },
  { name: 'complete an upload', method: 'POST', path: (ids) => `/api/cases/${ids.openCase}/files/${NO_FILE}/complete`, body: () => ({}), expect: ALL_SIGNED_IN_NOT_FOUND },
  { name: 'read a file', method: 'GET', path: (ids) => `/api/cases/${ids.openCase}/files/${NO_FILE}`, expect: ALL_SIGNED_IN_NOT_FOUND },
  { name: 'fetch a file', method: 'GET', path: (ids) => `/api/cases/${ids.openCase}/files/${NO_FILE}/content`, expect: ALL_SIGNED_IN_NOT_FOUND },
  { name: 'fetch a thumbnail', method: 'GET', path: (ids) => `/api/cases/${ids.openCase}/files/${NO_FILE}/thumbnail`, expect: ALL_SIGNED_IN_NOT_FOUND },
  { name: 'delete a file', method: 'DELETE', path: (ids) => `/api/cases/${ids.openCase}/files/${NO_FILE}`, expect: ALL_SIGNED_IN_NOT_FOUND },
  { name: 'import a walked survey', method: 'POST', path: (ids) => `/api/cases/${ids.openCase}/readings/import`, body: () => ({}), expect: HUNT_WRITE_BAD_BODY },
  { name: 'check a walked survey (dry run)', method: 'POST', path: (ids) => `/api/cases/${ids.openCase}/readings/import?dryRun=1`, body: () => ({}), expect: HUNT_WRITE_BAD_BODY },
  { name: 'read the level log', method: 'GET', path: (ids) => `/api/cases/${ids.openCase}/levels`, expect: HUNT_READ },
  { name: 'log a level', method: 'POST', path: (ids) => `/api/cases/${ids.openCase}/levels`, body: () => ({}), expect: HUNT_WRITE_BAD_BODY },
  { name: 'read own profile', method: 'GET', path: () => '/api/profile', expect: ALL_SIGNED_IN },
  { name: 'change own profile', method: 'PATCH', path: () => '/api/profile', body: () => ({}), expect: ALL_SIGNED_IN_BAD_BODY },
  { name: 'list assignable people', method: 'GET', path: () => '/api/people/hunters', expect: COMMITTEE_READ },
  // Notices. `locatedCase` is the demo's located case (reporter: the demo member, hunter assigned);
  // `notice` a draft on it that access.test.ts creates. `token` is made up: always a plain 404.
  { name: 'list notices', method: 'GET', path: (ids) => `/api/cases/${ids.locatedCase}/notices`, expect: HUNT_READ, hidden: RECIPIENT_DETAILS },
  {
    // The matrix's notice address is also on `otherLocatedCase` (a case the hunter is not assigned to).
    name: 'list notices asking about an address',
    method: 'GET',
    path: (ids) => `/api/cases/${ids.locatedCase}/notices?address=${encodeURIComponent(ids.noticeAddress)}`,
    expect: HUNT_READ,
    hidden: RECIPIENT_DETAILS,
  },
  { name: 'draft a notice', method: 'POST', path: (ids) => `/api/cases/${ids.locatedCase}/notices`, body: () => ({}), expect: COMMITTEE_BAD_BODY },
  { name: 'read a notice', method: 'GET', path: (ids) => `/api/cases/${ids.locatedCase}/notices/${ids.notice}`, expect: HUNT_READ, hidden: RECIPIENT_DETAILS },
  { name: 'edit a draft notice', method: 'PATCH', path: (ids) => `/api/cases/${ids.locatedCase}/notices/${ids.notice}`, body: () => ({}), expect: COMMITTEE_BAD_BODY },
  { name: 'approve a notice', method: 'POST', path: (ids) => `/api/cases/${ids.locatedCase}/notices/${ids.notice}/approve`, body: () => ({}), expect: COMMITTEE_BAD_BODY },
  { name: 'send a notice', method: 'POST', path: (ids) => `/api/cases/${ids.locatedCase}/notices/${ids.notice}/send`, body: () => ({}), expect: COMMITTEE_BAD_BODY },
  {
    name: 'retry a notice',
    method: 'POST',
    path: (ids) => `/api/cases/${ids.locatedCase}/notices/${ids.notice}/retry`,
    body: () => ({}),
    // allowed, then refused because nothing failed: 422
    expect: { anon: 401, admin: 422, coordinator: 422, hunter: 403, member: 403 },
  },
  { name: 'record a letter delivered', method: 'POST', path: (ids) => `/api/cases/${ids.locatedCase}/notices/${ids.notice}/delivered`, body: () => ({}), expect: COMMITTEE_BAD_BODY },
  // The preview and the letter name the household and carry the private response link.
  { name: 'preview a notice', method: 'GET', path: (ids) => `/api/cases/${ids.locatedCase}/notices/${ids.notice}/preview`, expect: COMMITTEE_READ },
  { name: 'print a letter', method: 'GET', path: (ids) => `/api/cases/${ids.locatedCase}/notices/${ids.notice}/letter`, expect: COMMITTEE_READ, contentType: /application\/pdf/ },
  { name: 'list templates', method: 'GET', path: () => '/api/templates', expect: ADMIN_ONLY },
  { name: 'read a template', method: 'GET', path: () => '/api/templates/first-notice', expect: ADMIN_ONLY },
  { name: 'save a template', method: 'PUT', path: () => '/api/templates/first-notice', body: () => ({}), expect: { anon: 401, admin: 400, coordinator: 403, hunter: 403, member: 403 } },
  { name: 'open a response link', method: 'GET', path: () => `/api/r/${'x'.repeat(43)}`, expect: { anon: 404, admin: 404, coordinator: 404, hunter: 404, member: 404 } },
  { name: 'answer a notice', method: 'POST', path: () => `/api/r/${'x'.repeat(43)}/answers`, body: () => ({ kind: 'fixed-it' }), expect: { anon: 404, admin: 404, coordinator: 404, hunter: 404, member: 404 } },
];
