import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type CreationOptional } from 'sequelize';
import { sequelize } from '@/server/db';

export type InvitationStatus = 'pending' | 'accepted' | 'declined' | 'withdrawn';

/** A teacher's invitation to an e-mail address; accepting it (signed in with that address) makes the link. */
export class StudioInvitation extends Model<
  InferAttributes<StudioInvitation>,
  InferCreationAttributes<StudioInvitation>
> {
  declare id: CreationOptional<string>;
  declare teacherId: string;
  /** Lower case, as typed by the teacher. */
  declare email: string;
  declare tokenHash: string;
  declare status: CreationOptional<InvitationStatus>;
  declare expiresAt: Date;
  declare answeredBy: CreationOptional<string | null>;
  declare answeredAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}
StudioInvitation.init(
  {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    teacherId: { type: DataTypes.STRING(64), allowNull: false },
    email: { type: DataTypes.STRING(255), allowNull: false },
    tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    status: {
      type: DataTypes.ENUM('pending', 'accepted', 'declined', 'withdrawn'),
      allowNull: false,
      defaultValue: 'pending',
    },
    expiresAt: { type: DataTypes.DATE(3), allowNull: false },
    answeredBy: { type: DataTypes.STRING(64), allowNull: true },
    answeredAt: { type: DataTypes.DATE(3), allowNull: true },
    createdAt: DataTypes.DATE(3),
    updatedAt: DataTypes.DATE(3),
  },
  { sequelize, tableName: 'studio_invitations', modelName: 'StudioInvitation' },
);
