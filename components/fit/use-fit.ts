'use client';

import { useCallback, useSyncExternalStore } from 'react';
import { useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api/client';
import type { FitDocument } from '@/lib/db/fit';
import type { LengthUnit } from '@/lib/fit/units';

export const fitKey = (styleId: string) => ['fit', styleId] as const;

/** The style's fit document, seeded with what the page read on the server. */
export function useFit(styleId: string, initial: FitDocument) {
  return useQuery({
    queryKey: fitKey(styleId),
    queryFn: () => api<{ fit: FitDocument }>(`/api/styles/${styleId}/fit`).then((r) => r.fit),
    initialData: initial,
    staleTime: 60_000,
  });
}

/** Puts a fit document a write answered with into the cache. */
export function useSetFit(styleId: string) {
  const qc = useQueryClient();
  return useCallback((doc: FitDocument) => qc.setQueryData(fitKey(styleId), doc), [qc, styleId]);
}

// The display unit is a preference of this browser; values are always stored in cm.
const unitKey = 'needlemap:fit-unit';
const listeners = new Set<() => void>();

function readUnit(): LengthUnit {
  try {
    return window.localStorage.getItem(unitKey) === 'in' ? 'in' : 'cm';
  } catch {
    return 'cm';
  }
}

export function useLengthUnit(): [LengthUnit, (u: LengthUnit) => void] {
  const unit = useSyncExternalStore(
    (cb) => { listeners.add(cb); return () => listeners.delete(cb); },
    readUnit,
    () => 'cm' as const,
  );
  const set = useCallback((u: LengthUnit) => {
    try { window.localStorage.setItem(unitKey, u); } catch { /* storage disabled: the choice lasts this page */ }
    listeners.forEach((l) => l());
  }, []);
  return [unit, set];
}
