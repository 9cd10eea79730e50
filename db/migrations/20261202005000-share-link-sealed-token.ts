import { DataTypes, type QueryInterface } from 'sequelize';

type Ctx = { context: QueryInterface };

/**
 * The link's token sealed with AES-256-GCM under SHARE_LINK_KEY (server/quotes/link-token-seal.ts),
 * so a colleague can copy an existing link. Never used for look-up (token_hash is). Links made
 * before this column stay null and simply cannot be copied again.
 */
export async function up({ context: qi }: Ctx): Promise<void> {
  await qi.addColumn('share_links', 'token_sealed', { type: DataTypes.STRING(200), allowNull: true });
}

export async function down({ context: qi }: Ctx): Promise<void> {
  await qi.removeColumn('share_links', 'token_sealed');
}
