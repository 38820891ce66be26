import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional } from 'sequelize';
import { sequelize } from '@/server/db';
import { decimalBpm } from './decimal';

/** A named region of a recording ("bridge", "bars 57–60"), kept with its song, with its own working and goal tempo. */
export class Passage extends Model<InferAttributes<Passage>, InferCreationAttributes<Passage>> {
  declare id: CreationOptional<string>;
  declare songId: string;
  declare recordingId: string;
  declare name: string;
  declare startSec: number;
  declare endSec: number;
  /** Bars as numbered on the recording's beat grid when the passage was marked (1 = the first bar). */
  declare startBar: number | null;
  declare endBar: number | null;
  declare workingBpm: number | null;
  declare goalBpm: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}
Passage.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    songId: { type: DataTypes.UUID, allowNull: false },
    recordingId: { type: DataTypes.UUID, allowNull: false },
    name: { type: DataTypes.STRING(120), allowNull: false },
    startSec: { type: DataTypes.DOUBLE, allowNull: false },
    endSec: { type: DataTypes.DOUBLE, allowNull: false },
    startBar: { type: DataTypes.INTEGER, allowNull: true },
    endBar: { type: DataTypes.INTEGER, allowNull: true },
    workingBpm: decimalBpm('workingBpm'),
    goalBpm: decimalBpm('goalBpm'),
    createdAt: DataTypes.DATE(3),
    updatedAt: DataTypes.DATE(3),
  },
  { sequelize, tableName: 'passages', modelName: 'Passage' },
);
