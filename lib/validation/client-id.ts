import { z } from 'zod';

/** A UUID made on the phone when an item is typed; retries of the same item carry the same one. */
export const clientIdSchema = z.uuid('clientId must be a UUID made when the item was typed.');
