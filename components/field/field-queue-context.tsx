'use client';

import { createContext, useContext } from 'react';

/**
 * Given by the field screen: forms inside it hand an item to the phone's offline queue instead of
 * failing when there is no connection. Outside the field screen there is none (a failed send is an error).
 */
export type FieldQueueHold = (url: string, body: Record<string, unknown> & { clientId: string }) => Promise<void>;

const FieldQueueContext = createContext<FieldQueueHold | null>(null);

export const FieldQueueProvider = FieldQueueContext.Provider;

export function useFieldQueueHold(): FieldQueueHold | null {
  return useContext(FieldQueueContext);
}

