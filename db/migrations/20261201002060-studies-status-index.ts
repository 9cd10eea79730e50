import type { QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

/**
 * The studies list leaves archived studies out by default (`status = 'ready'`): with status in
 * the index the count and the page of ids stay index-only however many studies a company has.
 */
export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.addIndex('studies', ['company_id', 'status', 'created_at'], { name: 'studies_company_status_created' });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.removeIndex('studies', 'studies_company_status_created');
}
