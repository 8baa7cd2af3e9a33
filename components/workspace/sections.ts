/** The style workspace's sections, in the design's order. Only those built so far are listed. */
export const workspaceSections = [
  { slug: '', label: 'Brief' },
  { slug: 'body-map', label: 'Body map' },
  { slug: 'textures', label: 'Textures' },
  { slug: 'yarns', label: 'Yarns & content' },
  { slug: 'colour', label: 'Colour' },
  { slug: 'fit', label: 'Fit' },
  { slug: 'trims', label: 'Trims' },
  { slug: 'mill-pack', label: 'Mill pack' },
  { slug: 'test-knits', label: 'Test knits' },
  { slug: 'quote', label: 'Quote' },
  { slug: 'history', label: 'History' },
] as const;
