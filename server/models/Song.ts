import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional } from 'sequelize';
import { sequelize } from '@/server/db';
import { decimalBpm as bpmColumn } from './decimal';

/** A piece a player is working on, with the tempos that matter for it. */
export class Song extends Model<InferAttributes<Song>, InferCreationAttributes<Song>> {
  declare id: CreationOptional<string>;
  declare ownerId: string;
  declare title: string;
  declare composer: string | null;
  /** The musical key as the player writes it ("D minor"); free text. */
  declare key: CreationOptional<string | null>;
  declare meter: CreationOptional<string>;
  declare goalBpm: number | null;
  declare workingBpm: number | null;
  declare chosenBpm: number | null;
  declare notes: string | null;
  declare chosenNote: CreationOptional<string | null>;
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
Song.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    ownerId: { type: DataTypes.STRING(64), allowNull: false },
    title: { type: DataTypes.STRING(200), allowNull: false },
    composer: { type: DataTypes.STRING(200), allowNull: true },
    key: { type: DataTypes.STRING(40), allowNull: true },
    meter: { type: DataTypes.STRING(8), allowNull: false, defaultValue: '4/4' },
    goalBpm: bpmColumn('goalBpm'),
    workingBpm: bpmColumn('workingBpm'),
    chosenBpm: bpmColumn('chosenBpm'),
    notes: { type: DataTypes.TEXT, allowNull: true },
    chosenNote: { type: DataTypes.TEXT, allowNull: true },
    workingSetBy: { type: DataTypes.STRING(64), allowNull: true },
    workingSetAt: { type: DataTypes.DATE(3), allowNull: true },
    goalSetBy: { type: DataTypes.STRING(64), allowNull: true },
    goalSetAt: { type: DataTypes.DATE(3), allowNull: true },
    previousWorking: { type: DataTypes.STRING(200), allowNull: true },
    createdAt: DataTypes.DATE(3),
    updatedAt: DataTypes.DATE(3),
  },
  { sequelize, tableName: 'songs', modelName: 'Song' },
);
