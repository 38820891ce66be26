// SWR hooks: how screens read server data. Mutations revalidate the keys they change.
import useSWR, { mutate } from 'swr';
import { ApiRequestError, apiFetch, fetcher } from './api';
import type {
  Candidate,
  Invitation,
  Me,
  Note,
  NoteInput,
  NotePatch,
  Passage,
  PassageInput,
  PassagePatch,
  PeaksDto,
  PracticeEntryDto,
  PracticeInput,
  Preferences,
  ReceivedInvitation,
  Recording,
  RecordingPatch,
  Role,
  Song,
  SongInput,
  SongPatch,
  SongTempos,
  Student,
  Teacher,
  UserSummary,
} from '@/shared/schemas';

export function useMe() {
  const { data, error, isLoading } = useSWR<Me>('/api/me', fetcher, { shouldRetryOnError: false });
  const signedOut = error instanceof ApiRequestError && error.status === 401;
  return { me: data, error: signedOut ? undefined : error, signedOut, isLoading };
}

export function useSongs() {
  const { data, error, isLoading } = useSWR<{ songs: Song[] }>('/api/songs', fetcher);
  return { songs: data?.songs, error, isLoading };
}

export async function addSong(input: SongInput) {
  const song = await apiFetch<Song>('/api/songs', { body: input });
  await mutate('/api/songs');
  return song;
}

export function useStudents(enabled: boolean) {
  const { data, error, isLoading } = useSWR<{ students: Student[] }>(enabled ? '/api/students' : null, fetcher);
  return { students: data?.students, error, isLoading };
}

/** A teacher ends the link with a student. */
export async function removeStudent(studentId: string) {
  await apiFetch(`/api/students/${studentId}`, { method: 'DELETE' });
  await mutate('/api/students');
}

// ── Invitations and teachers ─────────────────────────────────────────────────────────────────────────

export function useSentInvitations(enabled: boolean) {
  const { data } = useSWR<{ invitations: Invitation[] }>(enabled ? '/api/invitations' : null, fetcher);
  return { invitations: data?.invitations };
}

export async function inviteStudent(email: string) {
  await apiFetch('/api/invitations', { body: { email } });
  await mutate('/api/invitations');
}

export async function withdrawInvitation(id: string) {
  await apiFetch(`/api/invitations/${id}`, { method: 'DELETE' });
  await mutate('/api/invitations');
}

export function useReceivedInvitations() {
  const { data } = useSWR<{ invitations: ReceivedInvitation[] }>('/api/invitations/received', fetcher);
  return { invitations: data?.invitations };
}

/** The invitation a mailed link points at; works signed in or not. */
export function useInvitationByToken(token: string | undefined) {
  const { data, error, isLoading } = useSWR<ReceivedInvitation>(
    token ? `/api/invitations/token/${token}` : null,
    fetcher,
    { shouldRetryOnError: false },
  );
  return { invitation: data, error, isLoading };
}

export async function answerInvitation(id: string, answer: 'accept' | 'decline', token?: string) {
  await apiFetch(`/api/invitations/${id}/${answer}`, { method: 'POST', body: {} });
  await Promise.all([
    mutate('/api/invitations/received'),
    mutate('/api/teachers'),
    token ? mutate(`/api/invitations/token/${token}`) : null,
  ]);
}

export function useTeachers() {
  const { data } = useSWR<{ teachers: Teacher[] }>('/api/teachers', fetcher);
  return { teachers: data?.teachers };
}

/** A student ends the link with a teacher: the teacher loses access at once. */
export async function leaveTeacher(teacherId: string) {
  await apiFetch(`/api/teachers/${teacherId}`, { method: 'DELETE' });
  await mutate('/api/teachers');
}

export function useUsers(enabled: boolean) {
  const { data, error, isLoading } = useSWR<{ users: UserSummary[] }>(enabled ? '/api/admin/users' : null, fetcher);
  return { users: data?.users, error, isLoading };
}

export async function changeRole(userId: string, role: Role) {
  await apiFetch(`/api/admin/users/${userId}/role`, { method: 'PATCH', body: { role } });
  await mutate('/api/admin/users');
}

/** After sign-in or sign-out every cached answer belongs to someone else: drop them all. */
export const clearCache = () => mutate(() => true, undefined, { revalidate: true });

export function useSong(id: string | undefined) {
  const { data, error, isLoading } = useSWR<Song>(id ? `/api/songs/${id}` : null, fetcher);
  return { song: data, error, isLoading };
}

export function useRecordings(songId: string) {
  const key = `/api/songs/${songId}/recordings`;
  const { data, error, isLoading } = useSWR<{ recordings: Recording[] }>(key, fetcher, {
    // While an analysis is under way, look again every second.
    refreshInterval: (d) => (d?.recordings.some((r) => r.status === 'queued' || r.status === 'running') ? 1000 : 0),
  });
  return { recordings: data?.recordings, error, isLoading };
}

export function useRecording(id: string) {
  const { data, error, isLoading } = useSWR<Recording>(`/api/recordings/${id}`, fetcher, {
    refreshInterval: (d) => (d && (d.status === 'queued' || d.status === 'running') ? 1000 : 0),
  });
  return { recording: data, error, isLoading };
}

export function usePeaks(id: string, ready: boolean) {
  const { data } = useSWR<PeaksDto>(ready ? `/api/recordings/${id}/peaks` : null, fetcher);
  return data;
}

/** Queues a failed analysis again; the recording's own key then polls until it is done. */
export async function retryAnalysis(id: string) {
  await apiFetch(`/api/recordings/${id}/retry`, { method: 'POST', body: {} });
  await mutate(`/api/recordings/${id}`);
}

/** The player's word on a recording: the tempo, the beat level felt, the beat called one, a nudge of the grid. */
export async function correctRecording(id: string, patch: RecordingPatch) {
  const r = await apiFetch<Recording>(`/api/recordings/${id}`, { method: 'PATCH', body: patch });
  await mutate(`/api/recordings/${id}`, r, { revalidate: false });
  await mutate(`/api/songs/${r.songId}/recordings`);
  return r;
}

// ── Candidate tempos, the chosen tempo, the practice log ─────────────────────────────────────────────

const candidatesKey = (songId: string) => `/api/songs/${songId}/candidates`;

export function useCandidates(songId: string | undefined) {
  const { data, error } = useSWR<{ candidates: Candidate[] }>(songId ? candidatesKey(songId) : null, fetcher);
  return { candidates: data?.candidates, error };
}

export async function addCandidate(songId: string, bpm: number) {
  const c = await apiFetch<Candidate>(candidatesKey(songId), { body: { bpm } });
  await mutate(candidatesKey(songId));
  return c;
}

export async function changeCandidate(c: Candidate, patch: { rating?: number | null; note?: string | null }) {
  await apiFetch<Candidate>(`/api/candidates/${c.id}`, { method: 'PATCH', body: patch });
  await mutate(candidatesKey(c.songId));
}

export async function removeCandidate(c: Candidate) {
  await apiFetch(`/api/candidates/${c.id}`, { method: 'DELETE' });
  await mutate(candidatesKey(c.songId));
}

export async function chooseTempo(songId: string, bpm: number, note: string | null) {
  const song = await apiFetch<Song>(`/api/songs/${songId}/choose`, { body: { bpm, note } });
  await mutate(`/api/songs/${songId}`, song, { revalidate: false });
  await mutate('/api/songs');
  await mutate(candidatesKey(songId));
  return song;
}

const practiceKey = (songId: string) => `/api/songs/${songId}/practice`;

export function usePractice(songId: string | undefined) {
  const { data, error } = useSWR<{ entries: PracticeEntryDto[] }>(songId ? practiceKey(songId) : null, fetcher);
  return { entries: data?.entries, error };
}

export async function logPractice(songId: string, input: PracticeInput) {
  const entry = await apiFetch<PracticeEntryDto>(practiceKey(songId), { body: input });
  await mutate(practiceKey(songId));
  // A clean faster entry on a passage raises the passage's working tempo.
  await mutate(passagesKey(songId));
  await mutate(`/api/songs/${songId}`);
  await mutate('/api/songs');
  return entry;
}

// ── Notes on a recording ─────────────────────────────────────────────────────────────────────────────

const notesKey = (recordingId: string) => `/api/recordings/${recordingId}/notes`;

export function useNotes(recordingId: string) {
  const { data, error } = useSWR<{ notes: Note[] }>(notesKey(recordingId), fetcher, { refreshInterval: 30_000 });
  return { notes: data?.notes, error };
}

export async function addNote(recordingId: string, input: NoteInput) {
  await apiFetch(notesKey(recordingId), { body: input });
  await mutate(notesKey(recordingId));
}

export async function replyToNote(recordingId: string, noteId: string, text: string) {
  await apiFetch(`/api/notes/${noteId}/replies`, { body: { text } });
  await mutate(notesKey(recordingId));
}

export async function changeNote(recordingId: string, noteId: string, patch: NotePatch) {
  await apiFetch(`/api/notes/${noteId}`, { method: 'PATCH', body: patch });
  await mutate(notesKey(recordingId));
}

export async function deleteNote(recordingId: string, noteId: string) {
  await apiFetch(`/api/notes/${noteId}`, { method: 'DELETE' });
  await mutate(notesKey(recordingId));
}

// ── Settings ─────────────────────────────────────────────────────────────────────────────────────────

export function usePreferences() {
  const { data } = useSWR<Preferences>('/api/me/preferences', fetcher);
  return { preferences: data };
}

export async function setPreferences(patch: Partial<Preferences>) {
  await apiFetch('/api/me/preferences', { method: 'PATCH', body: patch });
  await mutate('/api/me/preferences');
}

/** Working and goal tempo of a song, by its player or their teacher. */
export async function setSongTempos(songId: string, tempos: SongTempos) {
  await apiFetch(`/api/songs/${songId}/tempos`, { method: 'PATCH', body: tempos });
  await mutate(`/api/songs/${songId}`);
}

export async function changeSong(id: string, patch: SongPatch) {
  await apiFetch(`/api/songs/${id}`, { method: 'PATCH', body: patch });
  await Promise.all([mutate(`/api/songs/${id}`), mutate('/api/songs')]);
}

/** Deletes the song with its recordings, passages, candidates and log. */
export async function deleteSong(id: string) {
  await apiFetch(`/api/songs/${id}`, { method: 'DELETE' });
  await mutate('/api/songs');
}

export async function renameRecording(r: Recording, label: string | null) {
  await apiFetch(`/api/recordings/${r.id}`, { method: 'PATCH', body: { label } });
  await Promise.all([mutate(`/api/recordings/${r.id}`), mutate(`/api/songs/${r.songId}/recordings`)]);
}

export async function deleteRecording(r: Recording) {
  await apiFetch(`/api/recordings/${r.id}`, { method: 'DELETE' });
  await mutate(`/api/songs/${r.songId}/recordings`);
}

// ── Passages: named regions of a song's recordings ───────────────────────────────────────────────────

const passagesKey = (songId: string) => `/api/songs/${songId}/passages`;

export function usePassages(songId: string | undefined) {
  const { data, error } = useSWR<{ passages: Passage[] }>(songId ? passagesKey(songId) : null, fetcher);
  return { passages: data?.passages, error };
}

export async function addPassage(songId: string, input: PassageInput) {
  const p = await apiFetch<Passage>(passagesKey(songId), { body: input });
  await mutate(passagesKey(songId));
  return p;
}

export async function changePassage(p: Passage, patch: PassagePatch) {
  const next = await apiFetch<Passage>(`/api/passages/${p.id}`, { method: 'PATCH', body: patch });
  await mutate(passagesKey(p.songId));
  return next;
}

/** A passage's own working and goal tempo (null clears one; a field left out stays as it is). */
export async function setPassageTempos(p: Passage, tempos: SongTempos) {
  const next = await apiFetch<Passage>(`/api/passages/${p.id}/tempos`, { method: 'PATCH', body: tempos });
  await mutate(passagesKey(p.songId));
  return next;
}

export async function removePassage(p: Passage) {
  await apiFetch(`/api/passages/${p.id}`, { method: 'DELETE' });
  await mutate(passagesKey(p.songId));
}
