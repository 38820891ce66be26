// Sign-in tables for better-auth (user, session, account, verification), owned by our own migrations.
// Field names follow better-auth's schema; table names are ours (see auth.ts modelName settings).
import { DataTypes, type QueryInterface } from 'sequelize';

const ID = { type: DataTypes.STRING(64), primaryKey: true, allowNull: false };
// Tokens compare byte for byte, not under the case-insensitive default collation.
const TOKEN = { type: DataTypes.STRING(255).BINARY, allowNull: false };
const timestamps = {
  createdAt: { type: DataTypes.DATE(3), allowNull: false },
  updatedAt: { type: DataTypes.DATE(3), allowNull: false },
};
const userRef = {
  type: DataTypes.STRING(64),
  allowNull: false,
  references: { model: 'users', key: 'id' },
  onDelete: 'CASCADE',
};

export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable('users', {
    id: ID,
    name: { type: DataTypes.STRING(200), allowNull: false },
    email: { type: DataTypes.STRING(320), allowNull: false, unique: true },
    emailVerified: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    image: { type: DataTypes.TEXT, allowNull: true },
    role: { type: DataTypes.ENUM('player', 'teacher', 'admin'), allowNull: false, defaultValue: 'player' },
    ...timestamps,
  });
  await qi.createTable('sessions', {
    id: ID,
    userId: userRef,
    token: { ...TOKEN, unique: true },
    expiresAt: { type: DataTypes.DATE(3), allowNull: false },
    ipAddress: { type: DataTypes.STRING(64), allowNull: true },
    userAgent: { type: DataTypes.TEXT, allowNull: true },
    ...timestamps,
  });
  await qi.addIndex('sessions', ['userId']);
  await qi.createTable('accounts', {
    id: ID,
    userId: userRef,
    accountId: { type: DataTypes.STRING(255), allowNull: false },
    providerId: { type: DataTypes.STRING(64), allowNull: false },
    accessToken: { type: DataTypes.TEXT, allowNull: true },
    refreshToken: { type: DataTypes.TEXT, allowNull: true },
    idToken: { type: DataTypes.TEXT, allowNull: true },
    accessTokenExpiresAt: { type: DataTypes.DATE(3), allowNull: true },
    refreshTokenExpiresAt: { type: DataTypes.DATE(3), allowNull: true },
    scope: { type: DataTypes.TEXT, allowNull: true },
    password: { type: DataTypes.TEXT, allowNull: true },
    ...timestamps,
  });
  await qi.addIndex('accounts', ['userId']);
  await qi.createTable('verifications', {
    id: ID,
    identifier: TOKEN,
    value: { type: DataTypes.TEXT, allowNull: false },
    expiresAt: { type: DataTypes.DATE(3), allowNull: false },
    ...timestamps,
  });
  await qi.addIndex('verifications', ['identifier']);
}

export async function down({ context: qi }: { context: QueryInterface }) {
  for (const table of ['verifications', 'accounts', 'sessions', 'users']) await qi.dropTable(table);
}
