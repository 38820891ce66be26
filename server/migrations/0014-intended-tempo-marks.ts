// Stretches of a recording its owner played freely on purpose (rubato) or slowing down (ritardando): the
// steadiness report leaves them out of drift and stability and draws them as such.
import { DataTypes, type QueryInterface } from 'sequelize';

export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable('tempo_marks', {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false },
    recordingId: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'recordings', key: 'id' },
      onDelete: 'CASCADE',
    },
    kind: { type: DataTypes.ENUM('rubato', 'ritardando'), allowNull: false },
    startSec: { type: DataTypes.DOUBLE, allowNull: false },
    endSec: { type: DataTypes.DOUBLE, allowNull: false },
    createdAt: { type: DataTypes.DATE(3), allowNull: false },
    updatedAt: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex('tempo_marks', ['recordingId', 'startSec']);
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.dropTable('tempo_marks');
}
