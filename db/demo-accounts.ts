// The invented demo group, institution, people and manuscript, as plain data shared by the seed, README and tests.
// Everything here is fictional; the passwords are public demo passwords for a local install only.
import type { MemberRole } from './schema';

/** An invented theory group at an invented institution. */
export const DEMO_GROUP = {
  name: 'Flux Line Theory Group',
  institution: 'Marrowby Institute for Mesoscopic Physics',
  domain: 'fluxlines.marrowby.example.org',
} as const;

/** A demo person. `role` is the manuscript role, or 'site-admin' for the administrator who is not a member. */
export interface DemoAccount {
  name: string;
  email: string;
  password: string;
  role: MemberRole | 'site-admin';
  isAdmin: boolean;
}

export const DEMO_ACCOUNTS: readonly DemoAccount[] = [
  {
    name: 'Ilse Varga-Moreno',
    email: `ilse.varga@${DEMO_GROUP.domain}`,
    password: 'demo-owner-flux',
    role: 'owner',
    isAdmin: false,
  },
  {
    name: 'Tobias Nwachukwu',
    email: `tobias.nwachukwu@${DEMO_GROUP.domain}`,
    password: 'demo-author-flux',
    role: 'author',
    isAdmin: false,
  },
  {
    name: 'Mireille Okonkwo-Lind',
    email: `mireille.okonkwo@${DEMO_GROUP.domain}`,
    password: 'demo-coauthor-flux',
    role: 'coauthor',
    isAdmin: false,
  },
  {
    name: 'Ruben Astley',
    email: `ruben.astley@${DEMO_GROUP.domain}`,
    password: 'demo-admin-flux',
    role: 'site-admin',
    isAdmin: true,
  },
];

/** The demo account holding a given role. */
export function demoAccount(role: DemoAccount['role']): DemoAccount {
  const account = DEMO_ACCOUNTS.find((a) => a.role === role);
  if (!account) throw new RangeError(`no demo account with role '${role}'`);
  return account;
}

/** The invented demo manuscript (a draft) that the owner, author and coauthor share. */
export const DEMO_MANUSCRIPT = {
  title: 'Level crossings forced by thin Aharonov–Bohm flux tubes in a hard-wall quantum well',
  slug: 'flux-tubes-in-a-quantum-well',
  abstract:
    'We study a charged particle confined to a two-dimensional hard-wall well that is threaded by one or two thin ' +
    'Aharonov–Bohm flux tubes. The vector potential of a tube changes the phase a wave function picks up around it ' +
    'without any magnetic field where the particle can be, so the spectrum depends only on the flux modulo one flux ' +
    'quantum. As the flux of a half-quantum tube is swept, levels of the disk and of irregular polygons cross; we map ' +
    'the positions of a tube at which two levels become degenerate, follow the geometric phase picked up around those ' +
    'points, and show how the nodal lines of the eigenfunctions end on the tubes.',
  status: 'draft' as const,
} as const;
