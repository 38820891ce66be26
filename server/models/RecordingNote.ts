import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional } from 'sequelize';
import { sequelize } from '@/server/db';

/** A note on a recording at a moment (atSec) or on a passage (startSec–endSec, bars), or a reply to one (parentId). */
export class RecordingNote extends Model<InferAttributes<RecordingNote>, InferCreationAttributes<RecordingNote>> {
  declare id: CreationOptional<string>;
  declare recordingId: string;
  declare authorId: string;
  declare parentId: string | null;
  declare atSec: number | null;
  declare startSec: number | null;
  declare endSec: number | null;
  declare startBar: number | null;
  declare endBar: number | null;
  declare text: string;
  declare resolved: CreationOptional<boolean>;
  /** When the note went out in its recording owner's e-mail digest; null until then. */
  declare mailedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}
RecordingNote.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    recordingId: { type: DataTypes.UUID, allowNull: false },
    authorId: { type: DataTypes.STRING(64), allowNull: false },
    parentId: { type: DataTypes.UUID, allowNull: true },
    atSec: { type: DataTypes.DOUBLE, allowNull: true },
    startSec: { type: DataTypes.DOUBLE, allowNull: true },
    endSec: { type: DataTypes.DOUBLE, allowNull: true },
    startBar: { type: DataTypes.INTEGER, allowNull: true },
    endBar: { type: DataTypes.INTEGER, allowNull: true },
    text: { type: DataTypes.TEXT, allowNull: false },
    resolved: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    mailedAt: { type: DataTypes.DATE(3), allowNull: true },
    createdAt: DataTypes.DATE(3),
    updatedAt: DataTypes.DATE(3),
  },
  { sequelize, tableName: 'recording_notes', modelName: 'RecordingNote' },
);
