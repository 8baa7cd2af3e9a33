/**
 * Roles and what each may do. Pure data: the one authorization helper (lib/auth/authorize.ts)
 * reads it, and so does the UI to hide what a role can't use.
 */
export const roles = ['admin', 'designer', 'colour-lead', 'client', 'mill'] as const;
export type Role = (typeof roles)[number];

export const roleLabels: Record<Role, string> = {
  admin: 'Admin',
  designer: 'Designer',
  'colour-lead': 'Colour lead',
  client: 'Client reviewer',
  mill: 'Mill',
};

export const permissions = [
  'style:read',
  /** The live working copy of a style (brief, body map, textures, yarns, trims): the mill gets released revisions instead. */
  'style:working-copy',
  'style:create',
  'style:edit',
  'style:archive',
  'style:share',
  'style:release',
  'members:manage',
  /** Studio-wide machine settings (stitch-rule limits): admin only. */
  'studio:settings',
  'library:read',
  'library:edit',
  'colour:edit',
  'labdip:decide',
  'proposal:comment',
  'proposal:decide',
  'mill:upload',
  'mill:download',
  'brief:read',
  'quote:read',
  'quote:edit',
] as const;
export type Permission = (typeof permissions)[number];

const grants: Record<Role, readonly Permission[]> = {
  admin: permissions,
  designer: [
    'style:read', 'style:working-copy', 'style:create', 'style:edit', 'style:archive', 'style:share', 'style:release',
    'library:read', 'library:edit', 'mill:download',
    'brief:read', 'quote:read', 'quote:edit',
  ],
  'colour-lead': ['style:read', 'style:working-copy', 'library:read', 'colour:edit', 'labdip:decide', 'mill:download', 'brief:read', 'quote:read'],
  client: ['style:read', 'style:working-copy', 'proposal:comment', 'proposal:decide', 'brief:read'],
  mill: ['style:read', 'mill:download', 'mill:upload'],
};

/** Costs, prices and margins: studio staff only, never the mill or the client. */
export function canSeeCosts(role: Role): boolean {
  return can(role, 'quote:read');
}

export function can(role: Role, permission: Permission): boolean {
  return grants[role].includes(permission);
}

/** Outside accounts see only what was shared with their organisation. */
export function isOutsideRole(role: Role): role is 'client' | 'mill' {
  return role === 'client' || role === 'mill';
}
