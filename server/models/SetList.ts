import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional } from 'sequelize';
import { sequelize } from '@/server/db';

/** A player's songs in playing order (the items), for a gig or a recital. */
export class SetList extends Model<InferAttributes<SetList>, InferCreationAttributes<SetList>> {
  declare id: CreationOptional<string>;
  declare ownerId: string;
  declare name: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}
SetList.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    ownerId: { type: DataTypes.STRING(64), allowNull: false },
    name: { type: DataTypes.STRING(120), allowNull: false },
    createdAt: DataTypes.DATE(3),
    updatedAt: DataTypes.DATE(3),
  },
  { sequelize, tableName: 'set_lists', modelName: 'SetList' },
);

/** One song at one place in a set list. */
export class SetListItem extends Model<InferAttributes<SetListItem>, InferCreationAttributes<SetListItem>> {
  declare id: CreationOptional<string>;
  declare setListId: string;
  declare songId: string;
  declare position: number;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}
SetListItem.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    setListId: { type: DataTypes.UUID, allowNull: false },
    songId: { type: DataTypes.UUID, allowNull: false },
    position: { type: DataTypes.INTEGER, allowNull: false },
    createdAt: DataTypes.DATE(3),
    updatedAt: DataTypes.DATE(3),
  },
  { sequelize, tableName: 'set_list_items', modelName: 'SetListItem' },
);
