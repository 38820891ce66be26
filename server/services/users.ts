// Accounts as an admin sees them.
import { User } from '@/server/models';
import { notFound } from '@/server/http';
import type { Me, Preferences, Role, UserSummary } from '@/shared/schemas';

export const toUserSummary = (u: User): UserSummary => ({
  id: u.id,
  name: u.name,
  email: u.email,
  role: u.role,
  emailVerified: Boolean(u.emailVerified),
  createdAt: u.createdAt.toISOString(),
});

export async function listUsers(): Promise<UserSummary[]> {
  return (await User.findAll({ order: [['createdAt', 'ASC']] })).map(toUserSummary);
}

export async function setRole(userId: string, role: Role): Promise<UserSummary> {
  const user = await User.findByPk(userId);
  if (!user) throw notFound('user');
  await user.update({ role });
  return toUserSummary(user);
}

/** A person's own settings: for now, whether new notes on their recordings reach them by e-mail. */
export async function getPreferences(me: Me): Promise<Preferences> {
  const user = await User.findByPk(me.id, { attributes: ['noteDigests'] });
  return { noteDigests: user?.noteDigests ?? true };
}

export async function setPreferences(me: Me, patch: Partial<Preferences>): Promise<Preferences> {
  await User.update(patch, { where: { id: me.id } });
  return getPreferences(me);
}
