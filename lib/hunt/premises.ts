import type { Knex } from 'knex';
import { appendEvent } from '@/db/cases';
import { getPlace } from '@/db/places';
import { savePremises, type PremisesHow } from '@/db/premises';
import type { User } from '@/db/types';
import { badRequest, forbidden } from '@/lib/errors';
import type { premisesSchema } from '@/lib/validation/places';
import type { z } from 'zod';
import { lockVisibleCase } from './case-detail';

export const HOW_WORDS: Record<PremisesHow, string> = {
  'level-peak': 'the level peaked there walking past on public ground',
  'switch-off-test': 'the noise stopped at a switch-off test the owner agreed to',
  other: 'another way (see the note)',
};

/**
 * A hunter (or the committee) records the premises confirmed on foot: a building from the places
 * layer, or a point and an address. Written with the case locked; the timeline gets a
 * committee-only comment that counts as the confirmation a coordinator can locate the case by.
 */
export async function confirmPremises(trx: Knex.Transaction, me: User, caseId: string, input: z.output<typeof premisesSchema>): Promise<void> {
  const { access } = await lockVisibleCase(trx, me, caseId);
  if (!access.hunt) throw forbidden('Only the assigned hunter or the committee can confirm the premises of a case being hunted.');
  let placeId: string | null = null;
  let { address, lat, lon } = input;
  if (input.placeId) {
    const place = await getPlace(input.placeId, trx);
    if (!place || place.kind !== 'building') throw badRequest('No such building in the places layer.', { issues: [{ path: 'placeId', message: 'Pick a building on the map.' }] });
    placeId = place.id;
    address = address || place.address || undefined;
    lat ??= place.lat;
    lon ??= place.lon;
    if (!address) throw badRequest('That building has no address in the places layer: type it.', { issues: [{ path: 'address', message: 'Type the address.' }] });
  }
  await savePremises(trx, caseId, { placeId, address: address!, lat: lat!, lon: lon!, confirmedBy: me.id, how: input.how, note: input.note });
  await appendEvent(trx, {
    caseId,
    actorId: me.id,
    kind: 'comment',
    data: { text: `Premises confirmed: ${address}; ${HOW_WORDS[input.how]}.${input.note ? ` ${input.note}` : ''}`, premisesConfirmed: true, placeId },
    visibility: 'committee',
  });
}
