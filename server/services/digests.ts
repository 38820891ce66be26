// The e-mail digest of new notes: a player hears about notes others left on their recordings in one mail,
// at most one every 15 minutes, with every new note since the last. Each server process runs the check; the
// claim on the user's row (lastDigestAt) makes sure only one of them sends.
import { Op, QueryTypes } from 'sequelize';
import { sequelize } from '@/server/db';
import { config } from '@/server/config';
import { Recording, RecordingNote, Song, User } from '@/server/models';
import { escapeHtml, sendMail } from '@/server/mail/mailer';
import { formatClock, plural } from '@/shared/format';

let timer: ReturnType<typeof setTimeout> | null = null;
let interval: ReturnType<typeof setInterval> | null = null;

/** A note was written: look once the gathering delay has passed (notes written together go in one mail). */
export function pokeDigests() {
  if (timer) return;
  timer = setTimeout(() => {
    timer = null;
    void sendDueDigests().catch((err) => console.error('[tactus] digest run failed:', err));
  }, config.digests.gatherMs + 50);
  timer.unref?.();
}

/** Also looks on a slow interval, so notes written through another process (or before a restart) go out too. */
export function startDigests() {
  interval ??= setInterval(
    () => void sendDueDigests().catch((err) => console.error('[tactus] digest run failed:', err)),
    config.digests.pollMs,
  );
  interval.unref?.();
}

export function stopDigests() {
  if (interval) clearInterval(interval);
  if (timer) clearTimeout(timer);
  interval = timer = null;
}

/** Sends every digest that is due now; returns how many mails went out. */
export async function sendDueDigests(now = new Date()): Promise<number> {
  const settled = new Date(now.getTime() - config.digests.gatherMs);
  // Owners with notes by someone else that no digest has handled yet, written at least the gathering delay ago.
  const owners = await sequelize.query<{ ownerId: string }>(
    `SELECT DISTINCT r.ownerId FROM recording_notes n JOIN recordings r ON r.id = n.recordingId
      WHERE n.mailedAt IS NULL AND n.authorId <> r.ownerId AND n.createdAt <= :settled`,
    { type: QueryTypes.SELECT, replacements: { settled } },
  );
  let sent = 0;
  for (const { ownerId } of owners) if (await digestFor(ownerId, now)) sent++;
  return sent;
}

async function digestFor(ownerId: string, now: Date): Promise<boolean> {
  const since = new Date(now.getTime() - config.digests.minGapMs);
  // The claim: only the process whose update lands sends, and not within 15 minutes of the last digest.
  const [claimed] = await User.update(
    { lastDigestAt: now },
    { where: { id: ownerId, [Op.or]: [{ lastDigestAt: null }, { lastDigestAt: { [Op.lte]: since } }] } },
  );
  if (!claimed) return false;
  const owner = (await User.findByPk(ownerId))!;
  const recordings = await Recording.findAll({
    where: { ownerId },
    attributes: ['id', 'songId', 'label', 'originalName', 'kind'],
  });
  const notes = await RecordingNote.findAll({
    where: { recordingId: recordings.map((r) => r.id), mailedAt: null, authorId: { [Op.ne]: ownerId } },
    include: [{ model: User, as: 'author', attributes: ['name'] }],
    order: [['createdAt', 'ASC']],
  });
  if (!notes.length) return false;
  await RecordingNote.update({ mailedAt: now }, { where: { id: notes.map((n) => n.id) } });
  if (!owner.noteDigests) return false;
  const songs = new Map(
    (
      await Song.findAll({ where: { id: [...new Set(recordings.map((r) => r.songId))] }, attributes: ['id', 'title'] })
    ).map((s) => [s.id, s.title]),
  );
  const byId = new Map(recordings.map((r) => [r.id, r]));
  const lines = notes.map((n) => {
    const r = byId.get(n.recordingId)!;
    const where = n.parentId
      ? 'replied'
      : n.atSec != null
        ? `at ${formatClock(n.atSec)}`
        : n.startBar != null
          ? `on bars ${n.startBar}–${n.endBar}`
          : `from ${formatClock(n.startSec ?? 0)}`;
    const name = (n as RecordingNote & { author?: User }).author?.name ?? 'Someone';
    const what = `${songs.get(r.songId) ?? 'a song'} (${r.label || r.originalName || (r.kind === 'take' ? 'a take' : 'a reference')})`;
    return { text: `${name} on ${what}, ${where}: “${n.text}”`, url: `${config.publicUrl}/recordings/${r.id}` };
  });
  const subject = `${plural(notes.length, 'new note')} on your recordings`;
  const esc = escapeHtml;
  const off = `${config.publicUrl}/account`;
  await sendMail({
    to: owner.email,
    subject,
    text: `Hello ${owner.name},\n\n${lines.map((l) => `• ${l.text}\n  ${l.url}`).join('\n\n')}\n\nYou get at most one of these every 15 minutes. Turn them off in Account: ${off}\n— Tactus`,
    html:
      `<p>Hello ${esc(owner.name)},</p><ul>${lines.map((l) => `<li><p>${esc(l.text)}</p><p><a href="${esc(l.url)}">Open the recording</a></p></li>`).join('')}</ul>` +
      `<p style="color:#666">You get at most one of these every 15 minutes. <a href="${esc(off)}">Turn them off in Account</a>.<br>— Tactus</p>`,
  }).catch((err) => console.error('[tactus] could not send a digest:', err));
  return true;
}
