import { PERMISSIONS } from '../../../shared/schemas/permissions';

import { roleAbilities, roleLimits } from './role-abilities';

describe('what a role may do', () => {
  it('when an owner is described, then every permission of the table an owner holds is named', () => {
    const owner = roleAbilities('owner');
    expect(owner).toContain('invite people, change roles (their own too) and remove members');
    expect(owner).toContain('delete sites');
    // Editing every basis covers editing the touch basis.
    expect(owner).not.toContain('edit the touch-safety basis of a site');
  });

  it('when a safety officer or contractor is described, then what the table limits them to is said', () => {
    expect(roleAbilities('safety')).toEqual(expect.arrayContaining(['edit the touch-safety basis of a site', 'verify and close register items']));
    expect(roleAbilities('safety')).not.toContain('create sites');
    expect(roleAbilities('contractor')).toContain('read only the sites they are added to');
    expect(roleLimits('viewer')).toContain('edit sites and all their design bases');
    expect(roleLimits('owner')).toEqual([]);
  });

  it('when any role is described, then it gets one line per permission it holds in the table, no more', () => {
    for (const role of ['owner', 'engineer', 'safety', 'contractor', 'viewer'] as const) {
      const held = Object.entries(PERMISSIONS)
        .filter(([, roles]) => (roles as readonly string[]).includes(role))
        .map(([k]) => k)
        .filter((k) => k !== 'team.read' && k !== 'dev.mail');
      const covered = held.includes('site.edit') && held.includes('site.editTouchBasis') ? 1 : 0;
      expect(roleAbilities(role)).toHaveLength(held.length - covered);
    }
  });
});
