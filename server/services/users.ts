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

/** A person's own settings: whether new notes on their recordings reach them by e-mail; how the player stretches. */
export async function getPreferences(me: Me): Promise<Preferences> {
  const user = await User.findByPk(me.id, { attributes: ['noteDigests', 'stretchMethod'] });
  return { noteDigests: user?.noteDigests ?? true, stretchMethod: user?.stretchMethod ?? 'phase-vocoder' };
}

export async function setPreferences(me: Me, patch: Partial<Preferences>): Promise<Preferences> {
  await User.update(patch, { where: { id: me.id } });
  return getPreferences(me);
}

/** Names of people by id, in one query (for "set by Marta Quist", "uploaded by …"). */
export async function namesOf(ids: (string | null | undefined)[]): Promise<Map<string, string>> {
  const wanted = [...new Set(ids.filter((id): id is string => Boolean(id)))];
  if (!wanted.length) return new Map();
  return new Map(
    (await User.findAll({ where: { id: wanted }, attributes: ['id', 'name'] })).map((u) => [u.id, u.name]),
  );
}

/** { id, name } for a person id, or null. */
export const personRef = (id: string | null | undefined, names: Map<string, string>) =>
  id ? { id, name: names.get(id) ?? 'Someone' } : null;

/** The who-and-when of working and goal tempos, as the API shows them. */
export function setByView(
  t: { workingSetBy: string | null; workingSetAt: Date | null; goalSetBy: string | null; goalSetAt: Date | null },
  names: Map<string, string>,
) {
  return {
    workingSetBy: personRef(t.workingSetBy, names),
    workingSetAt: t.workingSetAt?.toISOString() ?? null,
    goalSetBy: personRef(t.goalSetBy, names),
    goalSetAt: t.goalSetAt?.toISOString() ?? null,
  };
}

/** The columns that record who set the working and goal tempo in `patch` (only those it changes). */
export function setByColumns(userId: string, patch: { workingBpm?: number | null; goalBpm?: number | null }) {
  const now = new Date();
  return {
    ...(patch.workingBpm !== undefined ? { workingSetBy: userId, workingSetAt: now } : {}),
    ...(patch.goalBpm !== undefined ? { goalSetBy: userId, goalSetAt: now } : {}),
  };
}
