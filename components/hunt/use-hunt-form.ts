'use client';

import type { z } from 'zod';
import type { DefaultValues, FieldValues } from 'react-hook-form';
import { useApiForm } from '@/lib/api/use-api-form';
import { useFieldQueueHold } from '@/components/field/field-queue-context';
import { huntFieldFor } from './base-fields';
import { plainZodErrors } from './plain-zod-errors';

/**
 * A bearing or sweep form: the one form hook (useApiForm) with the hunt's plain number messages
 * and its field map (position problems show under the position). A 422 `accuracy-unconfirmed`
 * arrives as `problem.code`; SubmitFeedback then asks "use it anyway" and `resend`s the same
 * values with accuracyConfirmed. Inside the field screen, without a connection, the item goes to
 * the phone's offline queue and `onSaved(null)` runs: nothing typed in the field is lost.
 */
// eslint-disable-next-line @typescript-eslint/no-explicit-any -- any hunt schema
export function useHuntForm<S extends z.ZodType<any, any, any>, T>(
  schema: S,
  o: { url: string; defaultValues: DefaultValues<z.input<S> & FieldValues>; errorFields: Record<string, string>; onSaved: (data: T | null) => void },
) {
  return useApiForm<S, T>(schema, {
    defaultValues: o.defaultValues,
    request: () => ({ url: o.url }),
    errorMap: plainZodErrors,
    fieldFor: huntFieldFor(o.errorFields),
    onSuccess: (data) => o.onSaved(data),
    hold: useFieldQueueHold(),
    onHeld: () => o.onSaved(null),
  });
}
