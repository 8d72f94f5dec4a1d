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
 * Turns the form's setError into the setter useHuntSubmit wants: "samples[2].level" and
 * "samples.2.level" both land on samples.2.level; a path whose first part the form does not show
 * returns false so the message is shown with the general error.
 */
export function serverErrorSetter(setError: (name: never, error: { type: string; message: string }) => void, fields: Record<string, string>) {
  return (path: string, message: string): boolean => {
    const dotted = path.replace(/\[(\d+)\]/g, '.$1');
    const [top, ...rest] = dotted.split('.');
    const target = fields[top];
    if (!target) return false;
    setError((rest.length ? [target, ...rest].join('.') : target) as never, { type: 'server', message });
    return true;
  };
}
