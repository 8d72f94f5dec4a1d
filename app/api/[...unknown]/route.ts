import { route } from '@/lib/api/handler';
import { notFound } from '@/lib/errors';

/**
 * Any /api path no route handler serves: a JSON 404 with the API's headers (not the HTML
 * not-found page), whatever the method. A state-changing method still meets route()'s origin
 * check first, like every other API route.
 */
const missing = route<{ unknown: string[] }>({ body: 'raw' }, async () => {
  throw notFound('There is no such address in the API.');
});

export { missing as GET, missing as POST, missing as PUT, missing as PATCH, missing as DELETE };
