import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional, type Sequelize } from 'sequelize';
import { decimalAttribute } from './decimal-column';

/** One entry of a company's dish catalogue and price list; money as exact decimal strings. */
export class Dish extends Model<InferAttributes<Dish>, InferCreationAttributes<Dish>> {
  declare id: CreationOptional<number>;
  declare companyId: number;
  declare name: string;
  declare diameterM: string;
  declare efficiency: string;
  declare hardwarePrice: string;
  declare labourPrice: string;
  declare mountNotes: string | null;
  declare active: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initDish(sequelize: Sequelize): void {
  Dish.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      companyId: { type: DataTypes.INTEGER, allowNull: false },
      name: { type: DataTypes.STRING(120), allowNull: false },
      diameterM: decimalAttribute('diameterM', 5, 3, { allowNull: false }),
      efficiency: decimalAttribute('efficiency', 4, 3, { allowNull: false }),
      hardwarePrice: decimalAttribute('hardwarePrice', 10, 2, { allowNull: false }),
      labourPrice: decimalAttribute('labourPrice', 10, 2, { allowNull: false }),
      mountNotes: { type: DataTypes.TEXT, allowNull: true },
      active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'dishes', underscored: true },
  );
}
