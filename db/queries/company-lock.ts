import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { NotFoundError } from '@/server/errors';
import { models } from '../models';

declare const held: unique symbol;

/**
 * Proof that the company row is held FOR UPDATE inside `transaction`: what plan-limit checks and
 * quote numbering ask for, so they cannot run without the lock. Only lockCompanyRow makes one.
 */
export interface CompanyLock {
  readonly companyId: number;
  readonly transaction: Transaction;
  readonly [held]: true;
}

/**
 * Locks the company row until the transaction ends, so that work of one company which must not
 * overlap (a limit check and its insert, quote numbers, team changes) queues here. Take it BEFORE
 * the transaction's first insert or update: inserting a row with a foreign key to the company
 * takes a shared lock on the company row, and two transactions that both hold it deadlock when
 * each then asks for FOR UPDATE.
 *
 * Bad input: an unknown company id throws NotFoundError.
 */
export async function lockCompanyRow(companyId: number, t: Transaction): Promise<CompanyLock> {
  const rows = await models().sequelize.query<{ id: number }>('SELECT id FROM companies WHERE id = :companyId FOR UPDATE', {
    replacements: { companyId },
    type: QueryTypes.SELECT,
    transaction: t,
  });
  if (rows.length !== 1) throw new NotFoundError('That company');
  return { companyId, transaction: t } as CompanyLock;
}
