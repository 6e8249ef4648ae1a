import type { Role } from '@shared/schemas/auth';

/**
 * The demo scenario is invented: "Harrow Lane Power Systems" is not a real company and these
 * people do not exist. The accounts are for trying the product only.
 */
export const DEMO_COMPANY = 'Harrow Lane Power Systems (invented demo company)';

export interface DemoUser {
  username: string;
  displayName: string;
  email: string;
  role: Role;
  password: string;
}

export const DEMO_USERS: readonly DemoUser[] = [
  { username: 'erin', displayName: 'Erin Calder', email: 'erin@harrow-lane.example', role: 'engineer', password: 'demo-engineer-2026' },
  { username: 'tomas', displayName: 'Tomas Reyes', email: 'tomas@harrow-lane.example', role: 'engineer', password: 'demo-engineer-2026' },
  { username: 'ruth', displayName: 'Ruth Okafor', email: 'ruth@harrow-lane.example', role: 'reviewer', password: 'demo-reviewer-2026' },
  { username: 'wendell', displayName: 'Wendell Park', email: 'shop@harrow-lane.example', role: 'winder', password: 'demo-winder-2026' },
  { username: 'ada', displayName: 'Ada Lindqvist', email: 'ada@harrow-lane.example', role: 'admin', password: 'demo-admin-2026' },
];
