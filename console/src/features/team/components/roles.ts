import type { TeamRole } from '../api/team';

export const ROLE_LABELS: Record<TeamRole, string> = {
  owner: 'Owner: everything, including billing',
  admin: 'Admin: keys, team, usage, gear, audit',
  developer: 'Developer: own keys, usage, playground',
  photographer: 'Photographer: playground, setups, gear (read)',
};

/** Only owners may hand out the owner role. */
export function roleOptions(canGrantOwner: boolean) {
  return (Object.keys(ROLE_LABELS) as TeamRole[])
    .filter((role) => canGrantOwner || role !== 'owner')
    .map((role) => ({ value: role, label: ROLE_LABELS[role] }));
}
