'use client';

import { useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api/client';
import type { LibraryYarn } from '@/lib/db/yarns';
import type { LibraryTexture } from '@/lib/db/textures';

export function useYarns(initialData?: LibraryYarn[]) {
  return useQuery({
    queryKey: ['library', 'yarns'],
    queryFn: () => api<{ yarns: LibraryYarn[] }>('/api/library/yarns').then((r) => r.yarns),
    initialData,
  });
}

export function useTextures(initialData?: LibraryTexture[]) {
  return useQuery({
    queryKey: ['library', 'textures'],
    queryFn: () => api<{ textures: LibraryTexture[] }>('/api/library/textures').then((r) => r.textures),
    initialData,
  });
}
