import { getSequelize } from '../sequelize';
import { Company, initCompany } from './company';
import { Membership, initMembership } from './membership';
import { Plan, initPlan } from './plan';
import { Session, initSession } from './session';
import { User, initUser } from './user';

export { Company, Membership, Plan, Session, User };
export type { CompanyRole } from './membership';
export { COMPANY_ROLES } from './membership';

let ready = false;

/**
 * Initialises every model on the one Sequelize instance (once) and wires associations.
 * Call it before using a model class: `const { Study } = models();`.
 */
export function models() {
  if (!ready) {
    const sequelize = getSequelize();
    initPlan(sequelize);
    initCompany(sequelize);
    initUser(sequelize);
    initMembership(sequelize);
    initSession(sequelize);

    Company.belongsTo(Plan, { foreignKey: 'planId', as: 'plan' });
    Membership.belongsTo(Company, { foreignKey: 'companyId', as: 'company' });
    Membership.belongsTo(User, { foreignKey: 'userId', as: 'user' });
    Company.hasMany(Membership, { foreignKey: 'companyId', as: 'memberships' });
    User.hasMany(Membership, { foreignKey: 'userId', as: 'memberships' });
    Session.belongsTo(User, { foreignKey: 'userId', as: 'user' });
    ready = true;
  }
  return { sequelize: getSequelize(), Plan, Company, User, Membership, Session };
}
