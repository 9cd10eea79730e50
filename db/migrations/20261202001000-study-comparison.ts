import { DataTypes, type QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

/**
 * A study that compares several services for one site keeps one studies row per service: the
 * first service's row leads (it carries the revision chain, the title and the place in the list),
 * and every other service's row names it here. Quotes keep pointing at one row and one option
 * index, so nothing about quoting changes. Deleting the lead deletes its services with it.
 */
export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.addColumn('studies', 'comparison_of_study_id', {
    type: DataTypes.INTEGER,
    allowNull: true,
    references: { model: 'studies', key: 'id' },
    onDelete: 'CASCADE',
    onUpdate: 'CASCADE',
  });
  await qi.addIndex('studies', ['company_id', 'comparison_of_study_id'], { name: 'studies_company_comparison' });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  // The rows of the other services go with the column: they would otherwise show as studies of their own.
  await qi.sequelize.query('DELETE FROM studies WHERE comparison_of_study_id IS NOT NULL');
  // The foreign key's name is MariaDB's choice: look it up rather than guess it.
  const [keys] = (await qi.sequelize.query(
    "SELECT CONSTRAINT_NAME AS name FROM information_schema.KEY_COLUMN_USAGE WHERE TABLE_SCHEMA = DATABASE() AND TABLE_NAME = 'studies' AND COLUMN_NAME = 'comparison_of_study_id' AND REFERENCED_TABLE_NAME IS NOT NULL",
  )) as [{ name: string }[], unknown];
  for (const k of keys) await qi.removeConstraint('studies', k.name);
  await qi.removeIndex('studies', 'studies_company_comparison');
  await qi.removeColumn('studies', 'comparison_of_study_id');
}
