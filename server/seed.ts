// Seeds the demo studio once (a second run finds the teacher and does nothing). Sign-ins go through better-auth.
import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { auth } from './auth';
import { Account, PracticeEntry, User, StudioLink } from '@/server/models';
import { createSong } from '@/server/services/songs';
import { createSetList } from '@/server/services/setlists';
import { storeRecording } from '@/server/services/recordings';
import { checkAudio } from '@/server/analysis/audio-check';
import { config } from './config';
import { DEMO_PASSWORD, demoPeople, demoStudentEmails, demoTeacherEmail, type DemoRecording } from './demo-data';

const DEMO_AUDIO = path.resolve(__dirname, '../fixtures/demo');

export async function seedDemo(): Promise<{ created: boolean }> {
  if (await User.findOne({ where: { email: demoTeacherEmail } })) return { created: false };
  // Hash as better-auth does, and write the rows it would write for an e-mail sign-up ("credential"
  // account); demo accounts are confirmed up front, so no confirmation mail goes out for them.
  const { password } = await auth.$context;
  const hash = await password.hash(DEMO_PASSWORD);
  for (const person of demoPeople) {
    const now = new Date();
    const id = crypto.randomBytes(16).toString('hex');
    const user = await User.create({
      id,
      name: person.name,
      email: person.email,
      emailVerified: true,
      image: null,
      role: person.role,
      createdAt: now,
      updatedAt: now,
    });
    await Account.create({
      id: crypto.randomBytes(16).toString('hex'),
      userId: id,
      accountId: id,
      providerId: 'credential',
      password: hash,
      createdAt: now,
      updatedAt: now,
    });
    const me = { id: user.id, name: user.name, email: user.email, emailVerified: true, role: user.role };
    const songIds = new Map<string, string>();
    for (const { recordings = [], practice = [], ...input } of person.songs) {
      const song = await createSong(me, input);
      songIds.set(song.title, song.id);
      for (const r of recordings) await addDemoRecording(song, user.id, r);
      for (const { daysAgo, note, ...session } of practice) {
        // Dated in the past as written by hand then; logging it now would put all of it on today.
        const at = new Date(now.getTime() - daysAgo * 86_400_000);
        await PracticeEntry.create({
          songId: song.id,
          userId: user.id,
          passage: null,
          passageId: null,
          recordingId: null,
          startSec: null,
          endSec: null,
          startBar: null,
          endBar: null,
          ...session,
          note: note ?? null,
          createdAt: at,
          updatedAt: at,
        });
      }
    }
    for (const list of person.setLists ?? [])
      await createSetList(me, { name: list.name, songIds: list.songs.map((title) => songIds.get(title)!) });
  }
  const teacher = (await User.findOne({ where: { email: demoTeacherEmail } }))!;
  for (const email of demoStudentEmails) {
    const student = (await User.findOne({ where: { email } }))!;
    await StudioLink.create({ teacherId: teacher.id, studentId: student.id });
  }
  return { created: true };
}

/** Stored and queued as an upload would be; the server analyses it when it starts. */
async function addDemoRecording(song: Awaited<ReturnType<typeof createSong>>, ownerId: string, r: DemoRecording) {
  const file = path.join(DEMO_AUDIO, r.file);
  const audio = await checkAudio(file, config.uploads.maxDurationSec);
  await storeRecording({
    songId: song.id,
    ownerId,
    uploadedBy: null,
    kind: r.kind,
    label: r.label,
    originalName: r.file,
    spoolFile: file,
    sizeBytes: fs.statSync(file).size,
    audio,
  });
}

export function demoSignInTable(): string {
  const rows = demoPeople.map((p) => `  ${p.role.padEnd(8)} ${p.name.padEnd(14)} ${p.email}`);
  return [`Demo sign-ins (password for all: ${DEMO_PASSWORD}):`, ...rows].join('\n');
}
