import type { Role } from '../../../shared/schemas/auth.js';

/** How each role is named on screen. */
export const ROLE_LABELS: Record<Role, string> = { owner: 'Owner', electrician: 'Electrician', viewer: 'Viewer' };

/** What each role may do, in the words the invitation and members screens use. */
export const ROLE_ABILITIES: Record<Role, string> = {
  owner: 'everything, including members and organisation settings',
  electrician: 'create, edit and print boards',
  viewer: 'read and print boards',
};

export const ROLE_OPTIONS = (Object.keys(ROLE_LABELS) as Role[]).map((value) => ({ value, label: ROLE_LABELS[value] }));
