import Decimal from 'decimal.js';
import { DataTypes, type Model } from 'sequelize';

/** Normalises a raw DECIMAL value from the connector to an exact string with `scale` places. */
export function decimalString(value: unknown, scale: number): string | null {
  if (value === null || value === undefined) return null;
  return new Decimal(String(value)).toFixed(scale);
}

/**
 * A DECIMAL attribute that always reads back as an exact string with its scale ("220.0", "189.00").
 * Sequelize's MariaDB dialect turns on the connector's supportBigNumbers, which hands integral
 * decimals back as JS numbers (220) and the rest as strings ('46.500000'); this getter makes every
 * read the same shape, so money and coordinates never depend on the value.
 */
export function decimalAttribute(name: string, precision: number, scale: number, opts: { allowNull?: boolean; defaultValue?: string } = {}) {
  return {
    type: DataTypes.DECIMAL(precision, scale),
    allowNull: opts.allowNull ?? false,
    ...(opts.defaultValue !== undefined ? { defaultValue: opts.defaultValue } : {}),
    get(this: Model): string | null {
      return decimalString(this.getDataValue(name as never), scale);
    },
  };
}
