import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional, type Sequelize } from 'sequelize';

export const UPLOAD_KINDS = ['dish-catalogue', 'rain-curve', 'climate-normals'] as const;
export type UploadKind = (typeof UPLOAD_KINDS)[number];

/** An accepted CSV upload, kept byte for byte with the parse report that accepted it. */
export class Upload extends Model<InferAttributes<Upload>, InferCreationAttributes<Upload>> {
  declare id: CreationOptional<number>;
  declare companyId: number;
  declare kind: UploadKind;
  declare originalFilename: string;
  declare originalBytes: Buffer;
  declare sizeBytes: number;
  declare parseReport: unknown;
  declare status: CreationOptional<'applied'>;
  declare createdByUserId: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initUpload(sequelize: Sequelize): void {
  Upload.init(
    {
      id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
      companyId: { type: DataTypes.INTEGER, allowNull: false },
      kind: { type: DataTypes.ENUM(...UPLOAD_KINDS), allowNull: false },
      originalFilename: { type: DataTypes.STRING(255), allowNull: false },
      originalBytes: { type: DataTypes.BLOB('medium'), allowNull: false },
      sizeBytes: { type: DataTypes.INTEGER, allowNull: false },
      parseReport: { type: DataTypes.JSON, allowNull: false },
      status: { type: DataTypes.ENUM('applied'), allowNull: false, defaultValue: 'applied' },
      createdByUserId: { type: DataTypes.STRING(40), allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'uploads', underscored: true },
  );
}
