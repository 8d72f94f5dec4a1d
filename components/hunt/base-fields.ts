import type { BearingInput } from '@/lib/validation/bearings';

/**
 * The fields a bearing and a sweep share (position, north reference, frequency, one-way, note).
 * Shared field components read them through react-hook-form's form context.
 */
export type BaseFields = Pick<
  BearingInput,
  'lat' | 'lon' | 'positionSource' | 'positionAccuracyM' | 'accuracyConfirmed' | 'reference' | 'frequencyKhz' | 'oneWay' | 'note'
>;

/**
 * Which form field shows a server issue for each shared input path (position problems appear
 * under the position). Forms add their own fields.
 */
export const BASE_ERROR_FIELDS: Record<string, string> = {
  lat: 'lat',
  lon: 'lat',
  positionSource: 'lat',
  positionAccuracyM: 'lat',
  frequencyKhz: 'frequencyKhz',
  note: 'note',
};

/**
 * The field that shows a server issue at a dotted path ("samples.2.level" lands on samples.2.level,
 * "lon" on the position), or null for a path whose first part the form does not show (it is then
 * shown with the general message). For useApiForm's fieldFor.
 */
export function huntFieldFor(fields: Record<string, string>) {
  return (path: string): string | null => {
    const [top, ...rest] = path.split('.');
    const target = fields[top];
    return target ? [target, ...rest].join('.') : null;
  };
}
