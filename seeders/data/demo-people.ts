import type { Role } from '@shared/api/roles';

/**
 * The invented lab of the demo: Kestrel Fen Quantum Lab, two stations (North Hall and Mill Lane)
 * joined by 2.4 km of fibre. Its people, one per role and one with two roles.
 */
export const DEMO_LAB_NAME = 'Kestrel Fen Quantum Lab';

/** Every demo person signs in with this password (demo only; printed at start). */
export const DEMO_PASSWORD = 'fen-demo-2026';

export interface DemoPerson {
  email: string;
  name: string;
  roles: Role[];
}

export const DEMO_PEOPLE: readonly DemoPerson[] = [
  { email: 'maren.holt@kestrelfen.example', name: 'Maren Holt', roles: ['admin'] },
  { email: 'dev.okafor@kestrelfen.example', name: 'Dev Okafor', roles: ['experimentalist'] },
  { email: 'lucia.brandt@kestrelfen.example', name: 'Lucia Brandt', roles: ['shift-lead'] },
  { email: 'sami.virtanen@kestrelfen.example', name: 'Sami Virtanen', roles: ['auditor'] },
  { email: 'ada.reyes@kestrelfen.example', name: 'Ada Reyes', roles: ['experimentalist', 'shift-lead'] },
];
