import type { Permission } from '@/lib/auth/roles';

/** The style workspace's sections, in the design's order; a section with a permission shows only to roles that have it. */
export const workspaceSections: readonly { slug: string; label: string; permission?: Permission }[] = [
  { slug: '', label: 'Brief' },
  { slug: 'body-map', label: 'Body map' },
  { slug: 'textures', label: 'Textures' },
  { slug: 'yarns', label: 'Yarns & content' },
  { slug: 'colour', label: 'Colour' },
  { slug: 'fit', label: 'Fit' },
  { slug: 'trims', label: 'Trims' },
  { slug: 'mill-pack', label: 'Mill pack' },
  { slug: 'test-knits', label: 'Test knits' },
  { slug: 'quote', label: 'Quote', permission: 'quote:read' },
  { slug: 'history', label: 'History', permission: 'library:read' },
];
