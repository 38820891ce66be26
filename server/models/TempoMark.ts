import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional } from 'sequelize';
import { sequelize } from '@/server/db';

/** A stretch of a recording played freely on purpose (rubato) or slowing down (ritardando). */
export class TempoMark extends Model<InferAttributes<TempoMark>, InferCreationAttributes<TempoMark>> {
  declare id: CreationOptional<string>;
  declare recordingId: string;
  declare kind: 'rubato' | 'ritardando';
  declare startSec: number;
  declare endSec: number;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}
TempoMark.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    recordingId: { type: DataTypes.UUID, allowNull: false },
    kind: { type: DataTypes.ENUM('rubato', 'ritardando'), allowNull: false },
    startSec: { type: DataTypes.DOUBLE, allowNull: false },
    endSec: { type: DataTypes.DOUBLE, allowNull: false },
    createdAt: DataTypes.DATE(3),
    updatedAt: DataTypes.DATE(3),
  },
  { sequelize, tableName: 'tempo_marks', modelName: 'TempoMark' },
);
