// A teacher reaches a student's songs only through an invitation the student accepted. Links made before
// invitations existed (a teacher typed an e-mail address, nobody was asked) become pending invitations: the
// student now decides.
import crypto from 'node:crypto';
import { DataTypes, QueryTypes, type QueryInterface } from 'sequelize';

const INVITATION_DAYS = 7;

export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable('studio_invitations', {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false },
    teacherId: {
      type: DataTypes.STRING(64),
      allowNull: false,
      references: { model: 'users', key: 'id' },
      onDelete: 'CASCADE',
    },
    email: { type: DataTypes.STRING(255), allowNull: false },
    /** SHA-256 of the one-time token in the mailed link; the token itself is never stored. */
    tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    status: {
      type: DataTypes.ENUM('pending', 'accepted', 'declined', 'withdrawn'),
      allowNull: false,
      defaultValue: 'pending',
    },
    expiresAt: { type: DataTypes.DATE(3), allowNull: false },
    answeredBy: {
      type: DataTypes.STRING(64),
      allowNull: true,
      references: { model: 'users', key: 'id' },
      onDelete: 'SET NULL',
    },
    answeredAt: { type: DataTypes.DATE(3), allowNull: true },
    createdAt: { type: DataTypes.DATE(3), allowNull: false },
    updatedAt: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex('studio_invitations', ['teacherId', 'status']);
  await qi.addIndex('studio_invitations', ['email', 'status']);

  const links = await qi.sequelize.query<{ teacherId: string; email: string }>(
    'SELECT l.teacherId, u.email FROM studio_links l JOIN users u ON u.id = l.studentId',
    { type: QueryTypes.SELECT },
  );
  const now = new Date();
  const expiresAt = new Date(now.getTime() + INVITATION_DAYS * 24 * 3600 * 1000);
  for (const link of links) {
    await qi.bulkInsert('studio_invitations', [
      {
        id: crypto.randomUUID(),
        teacherId: link.teacherId,
        email: link.email.toLowerCase(),
        // A token nobody holds: the student answers in the app, where pending invitations to them are listed.
        tokenHash: crypto.createHash('sha256').update(crypto.randomBytes(32)).digest('hex'),
        status: 'pending',
        expiresAt,
        createdAt: now,
        updatedAt: now,
      },
    ]);
  }
  await qi.bulkDelete('studio_links', {});
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.dropTable('studio_invitations');
}
