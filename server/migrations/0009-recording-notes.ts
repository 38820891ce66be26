// Notes on a recording, by its owner or their teacher: at a moment or on a passage, with replies, open or
// resolved. `mailedAt` marks a note that went out in the owner's e-mail digest.
import { DataTypes, type QueryInterface } from 'sequelize';

export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable('recording_notes', {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false },
    recordingId: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'recordings', key: 'id' },
      onDelete: 'CASCADE',
    },
    authorId: {
      type: DataTypes.STRING(64),
      allowNull: false,
      references: { model: 'users', key: 'id' },
      onDelete: 'CASCADE',
    },
    parentId: {
      type: DataTypes.UUID,
      allowNull: true,
      references: { model: 'recording_notes', key: 'id' },
      onDelete: 'CASCADE',
    },
    atSec: { type: DataTypes.DOUBLE, allowNull: true },
    startSec: { type: DataTypes.DOUBLE, allowNull: true },
    endSec: { type: DataTypes.DOUBLE, allowNull: true },
    startBar: { type: DataTypes.INTEGER, allowNull: true },
    endBar: { type: DataTypes.INTEGER, allowNull: true },
    text: { type: DataTypes.TEXT, allowNull: false },
    resolved: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    mailedAt: { type: DataTypes.DATE(3), allowNull: true },
    createdAt: { type: DataTypes.DATE(3), allowNull: false },
    updatedAt: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex('recording_notes', ['recordingId', 'createdAt']);
  await qi.addIndex('recording_notes', ['mailedAt']);
  // Whether a player wants the e-mail digest of new notes (Account lets them turn it off).
  await qi.addColumn('users', 'noteDigests', { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true });
  await qi.addColumn('users', 'lastDigestAt', { type: DataTypes.DATE(3), allowNull: true });
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.removeColumn('users', 'lastDigestAt');
  await qi.removeColumn('users', 'noteDigests');
  await qi.dropTable('recording_notes');
}
