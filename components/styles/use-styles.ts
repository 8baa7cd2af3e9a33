'use client';

import { useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api/client';
import type { Style } from '@/lib/db/styles';
import type { Organisation } from '@/lib/db/organisations';

export function useStyles() {
  return useQuery({ queryKey: ['styles'], queryFn: () => api<{ styles: Style[] }>('/api/styles').then((r) => r.styles) });
}

export function useStyle(id: string) {
  return useQuery({ queryKey: ['styles', id], queryFn: () => api<{ style: Style }>(`/api/styles/${id}`).then((r) => r.style) });
}

export function useOrganisations(enabled = true) {
  return useQuery({
    queryKey: ['organisations'],
    enabled,
    queryFn: () => api<{ organisations: Organisation[] }>('/api/organisations').then((r) => r.organisations),
  });
}
