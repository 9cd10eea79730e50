import type { QueryInterface } from 'sequelize';
import { DEMO_COMPANIES } from '../demo/accounts';

type Ctx = { context: QueryInterface };

const QUILLFEATHER = DEMO_COMPANIES[0].name;

/**
 * The demo reseller moves from Crew to Fleet, the plan with API access, so the API reference's
 * curl examples run against the demo: sign in as its admin, make a key in Settings → API keys.
 * Only a company still on Crew is moved (a demo whose plan was changed by hand is left alone).
 */
export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.sequelize.query(
    `UPDATE companies c JOIN plans crew ON crew.id = c.plan_id AND crew.code = 'crew' JOIN plans fleet ON fleet.code = 'fleet'
        SET c.plan_id = fleet.id WHERE c.name = ?`,
    { replacements: [QUILLFEATHER] },
  );
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.sequelize.query(
    `UPDATE companies c JOIN plans fleet ON fleet.id = c.plan_id AND fleet.code = 'fleet' JOIN plans crew ON crew.code = 'crew'
        SET c.plan_id = crew.id WHERE c.name = ?`,
    { replacements: [QUILLFEATHER] },
  );
}
