import type { Knex } from 'knex';
import type { z } from 'zod';
import { insertLevel, listLevels } from '@/db/levels';
import { getClubSettings } from '@/db/settings';
import type { ClubSettings, User } from '@/db/types';
import { forbidden } from '@/lib/errors';
import { lockVisibleCase } from '@/lib/hunt/case-detail';
import type { levelReadingSchema } from '@/lib/validation/levels';
import { beforeAfter, levelToDbm, toLevelView, type LevelView } from './level-log';

/** Adds a reading: the committee, or the assigned hunter (any status: "after" comes once the case is fixed). */
export async function addLevel(trx: Knex.Transaction, me: User, caseId: string, input: z.output<typeof levelReadingSchema>): Promise<{ item: LevelView; created: boolean }> {
  const { access } = await lockVisibleCase(trx, me, caseId);
  if (!access.seeHunt) throw forbidden('Levels are logged by the committee and the assigned hunter.');
  const { row, created } = await insertLevel(trx, {
    caseId,
    clientId: input.clientId ?? null,
    authorId: me.id,
    frequencyKhz: input.frequencyKhz,
    levelUnit: input.level.unit,
    levelValue: input.level.value,
    overS9Db: input.level.unit === 'S' ? (input.level.overS9Db ?? 0) : 0,
    levelDbm: levelToDbm(input.level, input.frequencyKhz),
    bandwidthHz: input.bandwidthHz,
    takenAt: new Date(input.takenAt),
    lat: input.lat ?? null,
    lon: input.lon ?? null,
    phase: input.phase,
  });
  return { item: toLevelView(row, (await getClubSettings(trx)).noiseEnvironment), created };
}

export async function levelLog(q: Knex, caseId: string, environment: ClubSettings['noiseEnvironment']) {
  const rows = await listLevels(caseId, q);
  return { items: rows.map((r) => toLevelView(r, environment)), environment, beforeAfter: beforeAfter(rows) };
}
