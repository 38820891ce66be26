// Accounts as an admin sees them.
import { User } from '@/server/models';
import { HttpError, notFound } from '@/server/http';
import { forgetSessionsOf } from '@/server/middleware/session';
import type { Me, Preferences, Role, SongTempos, UserSummary } from '@/shared/schemas';

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
  await forgetSessionsOf(user.id);
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

/**
 * Names of people by id, in one query (for "set by Marta Quist", "uploaded by …"). The person asking is
 * known already: a player's own library, where every name is their own, needs no query at all.
 */
export async function namesOf(ids: (string | null | undefined)[], asking?: Me): Promise<Map<string, string>> {
  const known = new Map(asking ? [[asking.id, asking.name]] : []);
  const wanted = [...new Set(ids.filter((id): id is string => !!id && !known.has(id)))];
  if (!wanted.length) return known;
  for (const u of await User.findAll({ where: { id: wanted }, attributes: ['id', 'name'], raw: true }))
    known.set(u.id, u.name);
  return known;
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

interface WorkingTempo {
  workingBpm: number | null;
  workingSetBy: string | null;
  workingSetAt: Date | null;
  previousWorking: string | null;
}

/**
 * The columns a tempo patch writes on a song or passage: the tempos, who set them, and the working tempo it
 * replaces (kept as it was, setter included, so Undo can put it back). `undoWorking` puts the kept one back.
 */
export function tempoColumns(current: WorkingTempo, userId: string, patch: SongTempos) {
  if (patch.undoWorking) {
    if (!current.previousWorking)
      throw new HttpError(
        409,
        'nothing_to_undo',
        'undoWorking: there is no change of the working tempo to undo',
        'undoWorking',
      );
    const before = JSON.parse(current.previousWorking) as { bpm: number | null; by: string | null; at: string | null };
    return {
      workingBpm: before.bpm,
      workingSetBy: before.by,
      workingSetAt: before.at === null ? null : new Date(before.at),
      previousWorking: null,
    };
  }
  const { workingBpm, goalBpm } = patch;
  const replaced =
    workingBpm !== undefined && workingBpm !== current.workingBpm
      ? {
          previousWorking: JSON.stringify({
            bpm: current.workingBpm,
            by: current.workingSetBy,
            at: current.workingSetAt?.toISOString() ?? null,
          }),
        }
      : {};
  return {
    ...(workingBpm !== undefined ? { workingBpm } : {}),
    ...(goalBpm !== undefined ? { goalBpm } : {}),
    ...replaced,
    ...setByColumns(userId, { workingBpm, goalBpm }),
  };
}
