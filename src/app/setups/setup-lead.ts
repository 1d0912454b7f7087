import type { SetupDto, UserDto } from '@shared/api';

/** Whether `user` holds the shift-lead role and is one of `setup`'s shift leads, who sign off its runs and keep its upload tokens. */
export function leadsSetup(user: UserDto | null, setup: SetupDto | null): boolean {
  return user !== null && setup !== null && user.roles.includes('shift-lead') && setup.shiftLeads.some((lead) => lead.id === user.id);
}
