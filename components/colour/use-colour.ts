'use client';

import { useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api/client';
import type { ColourStandard } from '@/lib/db/colour-standards';
import type { StyleColourways } from '@/lib/db/colourways';
import type { LabDip } from '@/lib/db/lab-dips';
import type { BodyMap } from '@/lib/db/body-map';
import type { StyleTextures } from '@/lib/db/textures';

export const colourKeys = {
  colourways: (styleId: string) => ['styles', styleId, 'colourways'] as const,
  labDips: (styleId: string) => ['styles', styleId, 'lab-dips'] as const,
  standards: ['library', 'colour-standards'] as const,
};

export function useColourways(styleId: string) {
  return useQuery({ queryKey: colourKeys.colourways(styleId), queryFn: () => api<StyleColourways>(`/api/styles/${styleId}/colourways`) });
}

export function useLabDips(styleId: string) {
  return useQuery({
    queryKey: colourKeys.labDips(styleId),
    queryFn: () => api<{ labDips: LabDip[] }>(`/api/styles/${styleId}/lab-dips`).then((r) => r.labDips),
  });
}

export function useColourStandards(enabled = true) {
  return useQuery({
    queryKey: colourKeys.standards,
    enabled,
    queryFn: () => api<{ standards: ColourStandard[] }>('/api/library/colour-standards').then((r) => r.standards),
  });
}

/** The style's panels and zones, and its textures, for the colourway preview. */
export function usePreviewData(styleId: string, enabled = true) {
  const map = useQuery({ queryKey: ['styles', styleId, 'body-map'], enabled, queryFn: () => api<BodyMap>(`/api/styles/${styleId}/body-map`) });
  const textures = useQuery({ queryKey: ['styles', styleId, 'textures'], enabled, queryFn: () => api<StyleTextures>(`/api/styles/${styleId}/textures`) });
  return { map, textures };
}
