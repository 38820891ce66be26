// A studio: a teacher and the students who accepted the teacher's invitation. Nothing of a student's is
// visible to a teacher before that; either side ends the link at any time, which revokes access at once (the
// access module looks the link up on every request).
import crypto from 'node:crypto';
import { fn, col, Op } from 'sequelize';
import { PracticeEntry, Recording, RecordingNote, Song, StudioInvitation, StudioLink, User } from '@/server/models';
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

/**
 * A take waits for its teacher's answer this long: two weeks is two weekly lessons, after which it has been
 * heard at one or is past answering (a judgement of the trade, not a published figure). The flag is for what
 * to look at now, and a take the teacher has nothing to say on leaves it by itself.
 */
export const TAKE_ANSWER_DAYS = 14;

/**
 * Per recording, the open note threads (not resolved) that wait for this teacher: the latest word (the note, or
 * its last reply) is the recording owner's, and the thread is this teacher's to answer: they wrote in it, or the
 * owner started it after the link and no other teacher has written in it. A reply to another teacher waits for
 * that teacher; a thread from before the link is not this teacher's to answer.
 */
function threadsWaitingFor(
  teacherId: string,
  notes: RecordingNote[],
  ownerOf: Map<string, string>,
  linkedAt: Map<string, number>,
): Map<string, number> {
  const threads = new Map<string, RecordingNote[]>();
  for (const n of notes) {
    const key = n.parentId ?? n.id;
    threads.set(key, [...(threads.get(key) ?? []), n]);
  }
  const out = new Map<string, number>();
  for (const [key, thread] of threads) {
    const root = thread.find((n) => n.id === key);
    if (!root || root.resolved) continue;
    const owner = ownerOf.get(root.recordingId);
    const last = thread.reduce((a, b) => (b.createdAt >= a.createdAt ? b : a));
    if (!owner || last.authorId !== owner) continue;
    const teacherWrote = thread.some((n) => n.authorId === teacherId);
    const otherWrote = thread.some((n) => n.authorId !== owner && n.authorId !== teacherId);
    const sinceLink = root.authorId === owner && root.createdAt.getTime() >= (linkedAt.get(owner) ?? Infinity);
    if (teacherWrote || (sinceLink && !otherWrote)) out.set(root.recordingId, (out.get(root.recordingId) ?? 0) + 1);
  }
  return out;
}

/**
 * A teacher's students with their songs: tempos toward the goal, when each was last practised, recent takes, and
 * what waits for this teacher's answer (recent takes they have not written on, notes whose last word is the
 * student's).
 */
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
  const recordings = songIds.length
    ? await Recording.findAll({
        where: { songId: songIds },
        attributes: ['id', 'songId', 'ownerId', 'kind', 'label', 'originalName', 'uploadedBy', 'createdAt'],
        order: [['createdAt', 'DESC']],
      })
    : [];
  const notes = recordings.length
    ? await RecordingNote.findAll({
        where: { recordingId: recordings.map((r) => r.id) },
        attributes: ['id', 'recordingId', 'authorId', 'parentId', 'resolved', 'createdAt'],
        order: [['createdAt', 'ASC']],
      })
    : [];
  const since = new Map(links.map((l) => [l.studentId, l.createdAt.getTime()]));
  const open = threadsWaitingFor(teacherId, notes, new Map(recordings.map((r) => [r.id, r.ownerId])), since);
  const answered = new Set(notes.filter((n) => n.authorId === teacherId).map((n) => n.recordingId));
  const recent = Date.now() - TAKE_ANSWER_DAYS * 86_400_000;
  /** A take the student made lately, since the link, that this teacher has not written on. */
  const awaits = (r: Recording, studentId: string) =>
    r.kind === 'take' &&
    r.uploadedBy !== teacherId &&
    r.createdAt.getTime() >= Math.max(recent, since.get(studentId) ?? 0) &&
    !answered.has(r.id);
  const bySong = new Map<string, Recording[]>();
  for (const r of recordings) bySong.set(r.songId, [...(bySong.get(r.songId) ?? []), r]);
  const nameOf = (r: Recording) => r.label ?? r.originalName;
  return links.map((l) => {
    const s = (l as StudioLink & { student: User }).student;
    const own = songs.filter((song) => song.ownerId === s.id);
    const songDtos = own.map((song) => {
      const rows = bySong.get(song.id) ?? [];
      const takes = rows.filter((r) => r.kind === 'take');
      return {
        id: song.id,
        title: song.title,
        goalBpm: song.goalBpm,
        workingBpm: song.workingBpm,
        chosenBpm: song.chosenBpm,
        lastPracticedAt: lastBySong.get(song.id) ?? null,
        // The three newest takes are what a teacher looks at before a lesson, and every take that waits for an
        // answer, so each one the count names can be opened from the card.
        recentTakes: takes
          .filter((t, i) => i < 3 || awaits(t, s.id))
          .map((t) => ({
            id: t.id,
            label: nameOf(t),
            createdAt: t.createdAt.toISOString(),
            awaitingAnswer: awaits(t, s.id),
          })),
        notesAwaiting: rows
          .filter((r) => open.has(r.id))
          .map((r) => ({ recordingId: r.id, label: nameOf(r), notes: open.get(r.id)! })),
        takesAwaiting: takes.filter((t) => awaits(t, s.id)).length,
      };
    });
    return {
      id: s.id,
      name: s.name,
      email: s.email,
      songCount: own.length,
      songs: songDtos.map(({ takesAwaiting: _, ...song }) => song),
      awaiting: {
        takes: songDtos.reduce((sum, song) => sum + song.takesAwaiting, 0),
        notes: songDtos.reduce((sum, song) => sum + song.notesAwaiting.reduce((n, r) => n + r.notes, 0), 0),
      },
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
