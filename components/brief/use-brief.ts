'use client';

import { useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api/client';
import type { Brief, BriefReference } from '@/lib/db/briefs';
import type { BriefCheck } from '@/lib/rules/brief';

export const briefKey = (styleId: string) => ['brief', styleId] as const;
export const referencesKey = (styleId: string) => ['brief-references', styleId] as const;
export const checksKey = (styleId: string) => ['brief-checks', styleId] as const;
export const briefVersionsKey = (styleId: string) => ['brief-versions', styleId] as const;

export function useBrief(styleId: string, initialData?: Brief) {
  return useQuery({ queryKey: briefKey(styleId), initialData, staleTime: 30_000, queryFn: () => api<{ brief: Brief }>(`/api/styles/${styleId}/brief`).then((r) => r.brief) });
}

export function useReferences(styleId: string, initialData?: BriefReference[]) {
  return useQuery({
    queryKey: referencesKey(styleId),
    initialData,
    staleTime: 30_000,
    queryFn: () => api<{ references: BriefReference[] }>(`/api/styles/${styleId}/brief/references`).then((r) => r.references),
  });
}

export function useBriefChecks(styleId: string, initialData?: { checks: BriefCheck[]; saved: boolean }) {
  return useQuery({ queryKey: checksKey(styleId), initialData, staleTime: 30_000, queryFn: () => api<{ checks: BriefCheck[]; saved: boolean }>(`/api/styles/${styleId}/brief/checks`) });
}
