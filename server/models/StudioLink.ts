import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional } from 'sequelize';
import { sequelize } from '@/server/db';

/** A teacher and one of their students: the teacher may see the student's songs and takes. */
export class StudioLink extends Model<InferAttributes<StudioLink>, InferCreationAttributes<StudioLink>> {
  declare id: CreationOptional<string>;
  declare teacherId: string;
  declare studentId: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}
StudioLink.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    teacherId: { type: DataTypes.STRING(64), allowNull: false },
    studentId: { type: DataTypes.STRING(64), allowNull: false },
    createdAt: DataTypes.DATE(3),
    updatedAt: DataTypes.DATE(3),
  },
  { sequelize, tableName: 'studio_links', modelName: 'StudioLink' },
);
