import { Op } from 'sequelize';
import type { Deps } from '../deps';
import type { Role } from '../../shared/permissions';
import { bcryptCost, hashPassword, verifyPassword } from './passwords';

/**
 * The invented demo organisation: a regional distributor in the invented Quillmere Valley, with one
 * sign-in per role. One module for these constants — docs, browser tests and other seeds use them.
 */
export const DEMO_ORGANISATION_NAME = 'Quillmere Valley Freight';
export const DEMO_PLAN = 'team'; // five people need more than the free plan's three seats
export const DEMO_PASSWORD = 'quillmere-depot-42';

export const DEMO_USERS: ReadonlyArray<{ role: Role; email: string; name: string }> = [
  { role: 'owner', email: 'owner@quillmere.example', name: 'Maren Tolliver' },
  { role: 'admin', email: 'admin@quillmere.example', name: 'Ivo Brannoch' },
  { role: 'analyst', email: 'analyst@quillmere.example', name: 'Sefa Lindqvar' },
  { role: 'dispatcher', email: 'dispatcher@quillmere.example', name: 'Odile Farrowmere' },
  { role: 'viewer', email: 'viewer@quillmere.example', name: 'Tam Rusk' },
];

export interface DemoOrganisation {
  organisationId: number;
  users: Record<Role, { id: number; email: string; name: string }>;
}

/**
 * Create the demo organisation and its users if they are missing; never changes what exists
 * (a second run writes nothing). Other seeds (demo networks) take `organisationId` from here.
 */
export async function ensureDemoOrganisation(deps: Pick<Deps, 'db' | 'models' | 'config'>): Promise<DemoOrganisation> {
  const { Organisation, User, Membership } = deps.models;
  return deps.db.transaction(async (transaction) => {
    let org = await Organisation.findOne({ where: { name: DEMO_ORGANISATION_NAME, closedAt: { [Op.is]: null } }, order: [['id', 'ASC']], transaction });
    org ??= await Organisation.create({ name: DEMO_ORGANISATION_NAME, plan: DEMO_PLAN }, { transaction });
    let hash: string | null = null;
    const users = {} as DemoOrganisation['users'];
    for (const demo of DEMO_USERS) {
      let user = await User.findOne({ where: { email: demo.email }, transaction });
      if (!user) {
        hash ??= await hashPassword(DEMO_PASSWORD, bcryptCost(deps.config.NODE_ENV));
        user = await User.create({ email: demo.email, name: demo.name, passwordHash: hash, lastOrganisationId: org.id }, { transaction });
      }
      const member = await Membership.findOne({ where: { organisationId: org.id, userId: user.id }, transaction });
      if (!member) await Membership.create({ organisationId: org.id, userId: user.id, role: demo.role }, { transaction });
      users[demo.role] = { id: user.id, email: user.email, name: user.name };
    }
    return { organisationId: org.id, users };
  });
}

/** The sign-in lines `npm start` prints. */
export async function demoSignInText(deps: Pick<Deps, 'models'>): Promise<string> {
  const owner = await deps.models.User.findOne({ where: { email: DEMO_USERS[0].email } });
  const passwordWorks = owner ? await verifyPassword(DEMO_PASSWORD, owner.passwordHash) : false;
  const lines = DEMO_USERS.map((u) => `    ${u.role.padEnd(10)} ${u.email}`);
  return [
    `  Demo organisation "${DEMO_ORGANISATION_NAME}" — sign in as:`,
    ...lines,
    passwordWorks ? `    password   ${DEMO_PASSWORD}  (the same for all five)` : '    (the demo password was changed by someone; use "Forgot your password?")',
  ].join('\n');
}
