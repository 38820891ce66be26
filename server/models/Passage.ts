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
  /** Who last set the working and goal tempo (the player or their teacher), and when. */
  declare workingSetBy: CreationOptional<string | null>;
  declare workingSetAt: CreationOptional<Date | null>;
  declare goalSetBy: CreationOptional<string | null>;
  declare goalSetAt: CreationOptional<Date | null>;
  /** The working tempo the last change replaced, for Undo (see services/users.ts `workingUndo`). */
  declare previousWorking: CreationOptional<string | null>;
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
    workingSetBy: { type: DataTypes.STRING(64), allowNull: true },
    workingSetAt: { type: DataTypes.DATE(3), allowNull: true },
    goalSetBy: { type: DataTypes.STRING(64), allowNull: true },
    goalSetAt: { type: DataTypes.DATE(3), allowNull: true },
    previousWorking: { type: DataTypes.STRING(200), allowNull: true },
    createdAt: DataTypes.DATE(3),
    updatedAt: DataTypes.DATE(3),
  },
  { sequelize, tableName: 'passages', modelName: 'Passage' },
);
