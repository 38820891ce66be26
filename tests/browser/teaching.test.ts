// A teacher and a student through the whole loop in the browser: the teacher invites a new address, the
// invitee opens the caught mail's link, signs up, confirms, accepts and uploads a take; the teacher opens it
// from the Students screen (flagged as waiting for an answer) and writes a note at 0:42 and one on bars 9–12;
// the student sees both and replies; the teacher sees the reply, and the Students screen flags it. The teacher works at a desk (1280 px), the student on a phone (390 px); then the
// teacher's view on a phone: the notes before the player, the candidate tempos saying what a teacher can do.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { WaveFile } from 'wavefile';
import type { Browser, Page } from 'playwright-core';
import { launchChromium, outputDir, signInThroughApp, viewports } from './chromium';
import { baseUrl, linkPath, PASSWORD, signedInUser, uniqueEmail, waitForMail } from '@/tests/api/helpers';
import { clickTrack, steadyBeats } from '@/tests/unit/signals';

let browser: Browser;
const RATE = 22050;

/** 60 s of clicks at 120 BPM in 4/4 with accented downbeats: bar n starts at 0.5 + 2 (n − 1) s, so bar 9 at 16.5 s. */
function takeFile(): string {
  const beats = steadyBeats(120, 60);
  const accents = new Set(beats.map((_, i) => i).filter((i) => i % 4 === 0));
  const samples = clickTrack(beats, 60, RATE, accents);
  const wav = new WaveFile();
  wav.fromScratch(
    1,
    RATE,
    '16',
    Int16Array.from(samples, (x) => Math.round(Math.max(-1, Math.min(1, x)) * 32767)),
  );
  const file = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'tactus-teaching-')), 'scales-take.wav');
  fs.writeFileSync(file, wav.toBuffer());
  return file;
}

beforeAll(async () => {
  browser = await launchChromium();
});
afterAll(async () => {
  await browser?.close();
});

const open = async (viewport: (typeof viewports)[number]) => {
  const context = await browser.newContext({ viewport: { width: viewport.width, height: viewport.height } });
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  return { context, page, errors };
};
const shot = (page: Page, name: string) =>
  page.screenshot({ path: path.join(outputDir, `${name}.png`), fullPage: true });

test('invite, sign up through the link, upload a take, notes at a moment and on bars, a reply each way', async () => {
  const [phone, desk] = [viewports[0], viewports[1]];
  const teacher = await signedInUser('teach-ui', 'teacher');
  const studentEmail = uniqueEmail('teach-ui-student');

  // The teacher invites a new address from the Students screen.
  const t = await open(desk);
  await signInThroughApp(t.page, teacher.email, PASSWORD);
  await t.page.goto(`${baseUrl}/students`);
  await t.page.getByTestId('invite-email').fill(studentEmail);
  await t.page.getByTestId('send-invitation').click();
  await t.page.getByText(`Invitation sent to ${studentEmail}.`).waitFor();
  await t.page.getByTestId('pending-invitations').getByText(studentEmail).waitFor();

  // The invitee opens the mailed link on a phone, creates the account, confirms it and accepts.
  const invitation = await waitForMail(studentEmail, /invites you/);
  expect(invitation.text).toContain('Test teach-ui');
  const s = await open(phone);
  await s.page.goto(`${baseUrl}${linkPath(invitation)}`);
  await s.page.getByTestId('invitation').getByText('Test teach-ui').first().waitFor();
  await shot(s.page, 'teaching-invitation-phone');
  await s.page.getByTestId('invitation-sign-up').click();
  await s.page.getByTestId('name').fill('Wren Adeyemi');
  await s.page.getByTestId('email').fill(studentEmail);
  await s.page.getByTestId('password').fill(PASSWORD);
  await s.page.getByTestId('sign-up').click();
  await s.page.getByTestId('check-email').waitFor();
  const confirm = await waitForMail(studentEmail, /confirm/i);
  await s.page.goto(`${baseUrl}${linkPath(confirm)}`);
  await s.page.getByTestId('email').fill(studentEmail);
  await s.page.getByTestId('password').fill(PASSWORD);
  await s.page.getByTestId('sign-in').click();
  // Having created the account through the invitation, the student is linked as soon as they are signed in.
  await s.page.getByText('You are now Test teach-ui’s student.').waitFor();

  // The student adds a song and uploads a take of it.
  const song = await s.page.request.post(`${baseUrl}/api/songs`, {
    data: { title: 'Scales in Thirds', meter: '4/4', goalBpm: 132, workingBpm: 120 },
  });
  const songId = (await song.json()).id as string;
  await s.page.goto(`${baseUrl}/songs/${songId}`);
  await s.page.getByTestId('file-input').setInputFiles(takeFile());
  await s.page.getByTestId('upload').click();
  await s.page.getByTestId('recording').waitFor({ timeout: 30_000 });
  await s.page.getByTestId('tempo-result').waitFor({ timeout: 60_000 });
  const recordingUrl = s.page.url();

  // The teacher finds it from the Students screen, flagged as waiting for an answer, labelled with the student's
  // name.
  await t.page.goto(`${baseUrl}/students`);
  await t.page.getByTestId('student-awaiting').getByText('1 take waits for your answer').waitFor();
  await t.page
    .getByTestId('student-take')
    .getByText(/ · new$/)
    .waitFor();
  await shot(t.page, 'teaching-students-take-waits-desktop');
  await t.page.getByTestId('student-song').getByText('Scales in Thirds').click();
  await t.page.getByTestId('song').waitFor();
  await t.page.getByTestId('recording-row').first().click();
  await t.page.getByTestId('recording').waitFor();
  await t.page.getByText(/Wren’s take/).waitFor();
  await t.page.getByTestId('note-at').fill('0:42');
  await t.page.getByTestId('note-text').fill('The shift here rushes: keep the thumb under.');
  await t.page.getByTestId('note-add').click();
  await t.page.getByText('at 0:42').waitFor();
  await t.page.getByTestId('note-kind-bars').click();
  await t.page.getByTestId('note-from-bar').fill('9');
  await t.page.getByTestId('note-to-bar').fill('12');
  await t.page.getByTestId('note-text').fill('Bars 9–12 at 100 first, then step up.');
  await t.page.getByTestId('note-add').click();
  await t.page.getByText('bars 9–12', { exact: true }).waitFor();
  // The teacher is not offered the student's tempo corrections.
  expect(await t.page.getByText('Correct the tempo').count()).toBe(0);
  await shot(t.page, 'teaching-teacher-notes-desktop');

  // The student sees both notes, in the list and marked on the waveform, and a tap on one plays from there.
  await s.page.goto(recordingUrl);
  await s.page.getByText('at 0:42').waitFor();
  await s.page.getByTestId('overview-note').nth(1).waitFor();
  expect(await s.page.getByTestId('overview-note').count()).toBe(2);
  await s.page.getByTestId('note-place').filter({ hasText: 'at 0:42' }).click();
  await s.page.waitForFunction(
    () => document.querySelector('[data-testid="playback-position"]')?.getAttribute('aria-label') === '42.0 seconds',
  );
  const barsNote = s.page.getByTestId('note').filter({ hasText: 'bars 9–12' });
  await barsNote.getByTestId('note-reply-open').click();
  await barsNote.getByTestId('note-reply-text').fill('Will do, 100 it is.');
  await barsNote.getByTestId('note-reply-send').click();
  await barsNote.getByTestId('note-reply').filter({ hasText: 'Will do, 100 it is.' }).waitFor();
  await shot(s.page, 'teaching-student-notes-phone');

  // The teacher sees the reply.
  await t.page.reload();
  await t.page
    .getByTestId('note')
    .filter({ hasText: 'bars 9–12' })
    .getByTestId('note-reply')
    .filter({ hasText: 'Will do, 100 it is.' })
    .waitFor();
  // Stored on the grid: at 120 BPM a bar lasts 2 s, so bars 9–12 run 16–24 s after bar 1 (±1 beat of grid error).
  const recordingId = recordingUrl.split('/').pop()!;
  const stored = (await (await t.page.request.get(`${baseUrl}/api/recordings/${recordingId}/notes`)).json()).notes as {
    startBar: number | null;
    startSec: number | null;
    endSec: number | null;
    atSec: number | null;
  }[];
  const onBars = stored.find((n) => n.startBar === 9)!;
  const firstBar = onBars.startSec! - 16;
  expect(Math.abs(onBars.endSec! - onBars.startSec! - 8)).toBeLessThan(0.5);
  expect(firstBar).toBeGreaterThan(-0.6);
  expect(stored.find((n) => n.atSec !== null)!.atSec).toBe(42);

  // On the Students screen the take no longer waits (the teacher wrote on it); the student's reply does.
  await t.page.goto(`${baseUrl}/students`);
  await t.page.getByTestId('student-awaiting').getByText('1 note waits for your answer').waitFor();
  expect(
    await t.page
      .getByTestId('student-take')
      .getByText(/ · new$/)
      .count(),
  ).toBe(0);
  await t.page
    .getByTestId('student-notes-awaiting')
    .getByText(/^1 note to answer on /)
    .waitFor();
  await t.page.setViewportSize({ width: phone.width, height: phone.height });
  await shot(t.page, 'teaching-students-note-waits-phone');
  await t.page.setViewportSize({ width: desk.width, height: desk.height });
  // The chip leads to the recording, where the reply is.
  await t.page.getByTestId('student-notes-awaiting').click();
  await t.page.getByTestId('recording').waitFor();

  // On a phone the teacher reaches the notes before the player; the student's own view keeps the player first.
  const top = async (page: Page, testId: string) => (await page.getByTestId(testId).boundingBox())!.y;
  await t.page.setViewportSize({ width: phone.width, height: phone.height });
  await t.page.getByTestId('play').filter({ hasText: 'Play' }).waitFor();
  await t.page.getByTestId('compact-transport').waitFor();
  expect(await top(t.page, 'notes')).toBeLessThan(await top(t.page, 'audition'));
  expect(await top(s.page, 'audition')).toBeLessThan(await top(s.page, 'notes'));
  // The teacher cannot add candidate tempos, so is told what they can do there instead.
  await t.page
    .getByTestId('candidates')
    .getByText(/has not added candidate tempos yet.*say so in a note/)
    .waitFor();
  expect(await t.page.getByTestId('add-candidate').count()).toBe(0);
  await shot(t.page, 'teaching-teacher-notes-phone');
  expect(t.errors).toEqual([]);
  expect(s.errors).toEqual([]);
  await t.context.close();
  await s.context.close();
}, 180_000);
