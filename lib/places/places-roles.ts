import type { Role } from '@/db/types';

/** Who may load the places layer: hunters and the committee (map data, but the club's own). */
export const PLACES_ROLES = ['admin', 'coordinator', 'hunter'] as const satisfies readonly Role[];

export const mayLoadPlaces = (role: Role): boolean => (PLACES_ROLES as readonly Role[]).includes(role);
