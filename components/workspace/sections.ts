import type { Permission } from '@/lib/auth/roles';

/** The style workspace's sections, in the design's order; a section with a permission shows only to roles that have it.
 * The mill works from released revisions: it sees colour, fit, the mill pack and test knits only. */
export const workspaceSections: readonly { slug: string; label: string; permission?: Permission }[] = [
  { slug: '', label: 'Brief', permission: 'style:working-copy' },
  { slug: 'body-map', label: 'Body map', permission: 'style:working-copy' },
  { slug: 'textures', label: 'Textures', permission: 'style:working-copy' },
  { slug: 'yarns', label: 'Yarns & content', permission: 'style:working-copy' },
  { slug: 'colour', label: 'Colour' },
  { slug: 'fit', label: 'Fit' },
  { slug: 'trims', label: 'Trims', permission: 'style:working-copy' },
  { slug: 'mill-pack', label: 'Mill pack' },
  { slug: 'test-knits', label: 'Test knits' },
  { slug: 'quote', label: 'Quote', permission: 'quote:read' },
  { slug: 'history', label: 'History', permission: 'library:read' },
];
