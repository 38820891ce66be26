// A studio: a teacher and the students who accepted the teacher's invitation. Nothing of a student's is
// visible to a teacher before that; either side ends the link at any time, which revokes access at once (the
// access module looks the link up on every request).
import crypto from 'node:crypto';
import { fn, col, Op } from 'sequelize';
import { PracticeEntry, Recording, Song, StudioInvitation, StudioLink, User } from '@/server/models';
import { config } from '@/server/config';
import { HttpError, notFound } from '@/server/http';
import { linkMail, sendMail } from '@/server/mail/mailer';
import type { Invitation, Me, ReceivedInvitation, Student, Teacher } from '@/shared/schemas';
import { plural } from '@/shared/format';

/** How long an invitation link works (the teachers issue: 7 days). */
export const INVITATION_DAYS = 7;

const hashToken = (token: string) => crypto.createHash('sha256').update(token).digest('hex');
const expired = (i: StudioInvitation) => i.status === 'pending' && i.expiresAt.getTime() < Date.now();
const stateOf = (i: StudioInvitation) => (expired(i) ? 'expired' : i.status);

const toInvitationDto = (i: StudioInvitation): Invitation => ({
  id: i.id,
  email: i.email,
  status: stateOf(i),
  expiresAt: i.expiresAt.toISOString(),
  createdAt: i.createdAt.toISOString(),
});

async function toReceivedDto(i: StudioInvitation, user: Me | null): Promise<ReceivedInvitation> {
  const teacher = await User.findByPk(i.teacherId, { attributes: ['name'] });
  return {
    id: i.id,
    teacherName: teacher?.name ?? 'A teacher',
    email: i.email,
    status: stateOf(i),
    expiresAt: i.expiresAt.toISOString(),
    forYou: user ? user.email.toLowerCase() === i.email : null,
  };
}

/**
 * Sends an invitation with a one-time link. The answer is the same whether or not an account uses the address,
 * so inviting tells nobody who has an account. A new invitation to the same address replaces a pending one.
 */
export async function inviteStudent(teacher: Me, email: string): Promise<Invitation> {
  if (email === teacher.email.toLowerCase())
    throw new HttpError(400, 'invalid_body', 'email: you cannot invite yourself', 'email');
  await StudioInvitation.update(
    { status: 'withdrawn' },
    { where: { teacherId: teacher.id, email, status: 'pending' } },
  );
  const token = crypto.randomBytes(32).toString('base64url');
  const invitation = await StudioInvitation.create({
    teacherId: teacher.id,
    email,
    tokenHash: hashToken(token),
    expiresAt: new Date(Date.now() + INVITATION_DAYS * 24 * 3600 * 1000),
  });
  const url = `${config.publicUrl}/invitations/${token}`;
  const mail = linkMail(
    email,
    `${teacher.name} invites you to be their student on Tactus`,
    'Hello,',
    `${teacher.name} (${teacher.email}) would like to teach you on Tactus: they would see your songs, takes and practice log, leave notes on your takes and set working and goal tempos for you. Nothing is shared unless you accept, and you can end it at any time. The link works for ${plural(INVITATION_DAYS, 'day')} and only once.`,
    'See the invitation',
    url,
  );
  // Sent in the background: the answer must not take longer when the address is real.
  sendMail(mail).catch((err) => console.error('[tactus] could not send an invitation:', err));
  return toInvitationDto(invitation);
}

export async function listSentInvitations(teacher: Me): Promise<Invitation[]> {
  const rows = await StudioInvitation.findAll({
    where: { teacherId: teacher.id, status: 'pending' },
    order: [['createdAt', 'DESC']],
  });
  return rows.map(toInvitationDto);
}

export async function withdrawInvitation(teacher: Me, id: string): Promise<void> {
  const [n] = await StudioInvitation.update(
    { status: 'withdrawn' },
    { where: { id, teacherId: teacher.id, status: 'pending' } },
  );
  if (!n) throw notFound('invitation');
}

/** What the mailed link shows, signed in or not; the token is the only key. */
export async function invitationByToken(token: string, user: Me | null): Promise<ReceivedInvitation> {
  const i = await StudioInvitation.findOne({ where: { tokenHash: hashToken(token) } });
  if (!i) throw notFound('invitation');
  return toReceivedDto(i, user);
}

/** Pending invitations to the signed-in person's address. */
export async function listReceivedInvitations(user: Me): Promise<ReceivedInvitation[]> {
  const rows = await StudioInvitation.findAll({
    where: { email: user.email.toLowerCase(), status: 'pending', expiresAt: { [Op.gt]: new Date() } },
    order: [['createdAt', 'DESC']],
  });
  return Promise.all(rows.map((i) => toReceivedDto(i, user)));
}

/** Only the invited address may answer, once, before the invitation expires. */
async function answerable(user: Me, id: string): Promise<StudioInvitation> {
  const i = await StudioInvitation.findByPk(id);
  if (!i) throw notFound('invitation');
  if (user.email.toLowerCase() !== i.email) {
    throw new HttpError(
      403,
      'wrong_account',
      'This invitation was sent to another e-mail address: sign in with that address to answer it.',
    );
  }
  if (expired(i))
    throw new HttpError(410, 'expired', 'This invitation has expired. Ask your teacher to send a new one.');
  if (i.status !== 'pending') throw new HttpError(410, 'answered', `This invitation was already ${i.status}.`);
  return i;
}

export async function acceptInvitation(user: Me, id: string): Promise<Teacher> {
  const i = await answerable(user, id);
  if (i.teacherId === user.id) throw new HttpError(400, 'invalid_body', 'you cannot be your own student');
  const [link] = await StudioLink.findOrCreate({ where: { teacherId: i.teacherId, studentId: user.id } });
  await i.update({ status: 'accepted', answeredBy: user.id, answeredAt: new Date() });
  const teacher = (await User.findByPk(i.teacherId))!;
  return { id: teacher.id, name: teacher.name, email: teacher.email, since: link.createdAt.toISOString() };
}

export async function declineInvitation(user: Me, id: string): Promise<void> {
  const i = await answerable(user, id);
  await i.update({ status: 'declined', answeredBy: user.id, answeredAt: new Date() });
}

/** A teacher's students with their songs: tempos toward the goal, when each was last practised, recent takes. */
export async function listStudents(teacherId: string): Promise<Student[]> {
  const links = await StudioLink.findAll({
    where: { teacherId },
    include: [{ model: User, as: 'student', attributes: ['id', 'name', 'email'] }],
    order: [['createdAt', 'ASC']],
  });
  const ids = links.map((l) => l.studentId);
  if (!ids.length) return [];
  const songs = await Song.findAll({ where: { ownerId: ids }, order: [['updatedAt', 'DESC']] });
  const songIds = songs.map((s) => s.id);
  const practised = songIds.length
    ? ((await PracticeEntry.findAll({
        attributes: ['songId', [fn('MAX', col('createdAt')), 'last']],
        where: { songId: songIds },
        group: ['songId'],
        raw: true,
      })) as unknown as { songId: string; last: Date }[])
    : [];
  const lastBySong = new Map(practised.map((p) => [p.songId, new Date(p.last).toISOString()]));
  const takes = songIds.length
    ? await Recording.findAll({
        where: { songId: songIds, kind: 'take' },
        attributes: ['id', 'songId', 'label', 'originalName', 'createdAt'],
        order: [['createdAt', 'DESC']],
      })
    : [];
  const takesBySong = new Map<string, Recording[]>();
  for (const t of takes) takesBySong.set(t.songId, [...(takesBySong.get(t.songId) ?? []), t]);
  return links.map((l) => {
    const s = (l as StudioLink & { student: User }).student;
    const own = songs.filter((song) => song.ownerId === s.id);
    return {
      id: s.id,
      name: s.name,
      email: s.email,
      songCount: own.length,
      songs: own.map((song) => ({
        id: song.id,
        title: song.title,
        goalBpm: song.goalBpm,
        workingBpm: song.workingBpm,
        chosenBpm: song.chosenBpm,
        lastPracticedAt: lastBySong.get(song.id) ?? null,
        // The three newest takes are what a teacher looks at before a lesson.
        recentTakes: (takesBySong.get(song.id) ?? [])
          .slice(0, 3)
          .map((t) => ({ id: t.id, label: t.label ?? t.originalName, createdAt: t.createdAt.toISOString() })),
      })),
    };
  });
}

export async function listTeachers(studentId: string): Promise<Teacher[]> {
  const links = await StudioLink.findAll({
    where: { studentId },
    include: [{ model: User, as: 'teacher', attributes: ['id', 'name', 'email'] }],
    order: [['createdAt', 'ASC']],
  });
  return links.map((l) => {
    const t = (l as StudioLink & { teacher: User }).teacher;
    return { id: t.id, name: t.name, email: t.email, since: l.createdAt.toISOString() };
  });
}

/** Either side ends the link; access stops with the next request. */
export async function endLink(teacherId: string, studentId: string): Promise<void> {
  const removed = await StudioLink.destroy({ where: { teacherId, studentId } });
  if (!removed) throw notFound('link');
}
