/** The roles a Bellkeep user can hold; a user may hold several. */
export const ROLES = ['admin', 'experimentalist', 'shift-lead', 'auditor'] as const;

/** One of {@link ROLES}. */
export type Role = (typeof ROLES)[number];

/** Words shown for each role in the app and in e-mails. */
export const ROLE_LABELS: Readonly<Record<Role, string>> = {
  admin: 'Admin',
  experimentalist: 'Experimentalist',
  'shift-lead': 'Shift lead',
  auditor: 'Auditor',
};

/** Whether `value` names a role. */
export function isRole(value: unknown): value is Role {
  return typeof value === 'string' && (ROLES as readonly string[]).includes(value);
}
