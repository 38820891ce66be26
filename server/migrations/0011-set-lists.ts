// Set lists: a player's songs in playing order, each played at its chosen tempo.
import { DataTypes, type QueryInterface } from 'sequelize';

const timestamps = {
  createdAt: { type: DataTypes.DATE(3), allowNull: false },
  updatedAt: { type: DataTypes.DATE(3), allowNull: false },
};

export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable('set_lists', {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false },
    ownerId: {
      type: DataTypes.STRING(64),
      allowNull: false,
      references: { model: 'users', key: 'id' },
      onDelete: 'CASCADE',
    },
    name: { type: DataTypes.STRING(120), allowNull: false },
    ...timestamps,
  });
  await qi.addIndex('set_lists', ['ownerId', 'updatedAt']);
  await qi.createTable('set_list_items', {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false },
    setListId: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'set_lists', key: 'id' },
      onDelete: 'CASCADE',
    },
    songId: { type: DataTypes.UUID, allowNull: false, references: { model: 'songs', key: 'id' }, onDelete: 'CASCADE' },
    position: { type: DataTypes.INTEGER, allowNull: false },
    ...timestamps,
  });
  await qi.addIndex('set_list_items', ['setListId', 'position']);
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.dropTable('set_list_items');
  await qi.dropTable('set_lists');
}
