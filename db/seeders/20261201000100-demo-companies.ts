import type { QueryInterface } from 'sequelize';
import { randomBytes } from 'node:crypto';
import { hashPassword } from '../../server/auth/password';
import { DEMO_PASSWORD, DEMO_USERS, DEMO_COMPANIES } from '../demo/accounts';

type Ctx = { context: QueryInterface };

const userId = () => 'usr_' + randomBytes(12).toString('base64url');

/** The invented demo scenario: two companies (to show isolation), one person per role, one staff operator. */
export async function up({ context: qi }: Ctx): Promise<void> {
  const sequelize = qi.sequelize;
  await sequelize.transaction(async (transaction) => {
    const now = new Date();
    const [plans] = (await sequelize.query('SELECT id, code FROM plans', { transaction })) as [{ id: number; code: string }[], unknown];
    const planId = (code: string) => {
      const plan = plans.find((p) => p.code === code);
      if (!plan) throw new Error(`plan "${code}" is missing: run the migrations first`);
      return plan.id;
    };
    const passwordHash = await hashPassword(DEMO_PASSWORD);
    const companyIds: Record<string, number> = {};
    for (const company of DEMO_COMPANIES) {
      await qi.bulkInsert('companies', [{ name: company.name, plan_id: planId(company.planCode), trial_ends_at: null, created_at: now, updated_at: now }], { transaction });
      const [[row]] = (await sequelize.query('SELECT id FROM companies WHERE name = ? ORDER BY id DESC LIMIT 1', { replacements: [company.name], transaction })) as [{ id: number }[], unknown];
      companyIds[company.key] = row.id;
    }
    for (const person of DEMO_USERS) {
      const id = userId();
      await qi.bulkInsert('users', [{ id, email: person.email, name: person.name, password_hash: passwordHash, is_staff: person.role === 'staff', created_at: now, updated_at: now }], { transaction });
      if (person.role !== 'staff') {
        await qi.bulkInsert('memberships', [{ company_id: companyIds[person.company], user_id: id, role: person.role, created_at: now, updated_at: now }], { transaction });
      }
    }
  });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.bulkDelete('users', { email: DEMO_USERS.map((u) => u.email) });
  await qi.bulkDelete('companies', { name: DEMO_COMPANIES.map((c) => c.name) });
}
