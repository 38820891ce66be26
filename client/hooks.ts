// SWR hooks: how screens read server data. Mutations revalidate the keys they change.
import useSWR, { mutate } from 'swr';
import { Linking, Platform } from 'react-native';
import { ApiRequestError, apiBase, apiFetch, fetcher } from './api';
import type {
  Candidate,
  Invitation,
  SongListItem,
  LibrarySort,
  LibraryStatus,
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
  PracticeLogEntry,
  Preferences,
  ReceivedInvitation,
  Recording,
  SetListDto,
  RecordingPatch,
  Role,
  Song,
  SongInput,
  SongPatch,
  SongTempos,
  Student,
  TempoMark,
  TempoMarkInput,
  Teacher,
  UserSummary,
} from '@/shared/schemas';

export function useMe() {
  const { data, error, isLoading } = useSWR<Me>('/api/me', fetcher, { shouldRetryOnError: false });
  const signedOut = error instanceof ApiRequestError && error.status === 401;
  return { me: data, error: signedOut ? undefined : error, signedOut, isLoading };
}

/** The library, searched, sorted and filtered by the server; the last answer stays on screen while the next loads. */
export function useSongs(query: { q?: string; sort?: LibrarySort; status?: LibraryStatus } = {}) {
  const params = new URLSearchParams();
  if (query.q?.trim()) params.set('q', query.q.trim());
  if (query.sort && query.sort !== 'title') params.set('sort', query.sort);
  if (query.status) params.set('status', query.status);
  const search = params.toString();
  const key = search ? `/api/songs?${search}` : '/api/songs';
  const { data, error, isLoading, isValidating } = useSWR<{ songs: SongListItem[] }>(key, fetcher, {
    keepPreviousData: true,
  });
  return { songs: data?.songs, error, isLoading, isValidating };
}

/** Every cached library listing (each search, sort and filter has its own key). */
const refreshLibrary = () =>
  mutate((key) => typeof key === 'string' && (key === '/api/songs' || key.startsWith('/api/songs?')));

export async function addSong(input: SongInput) {
  const song = await apiFetch<Song>('/api/songs', { body: input });
  await refreshLibrary();
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
  await refreshLibrary();
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
  // The library shows when each song was last practised.
  await Promise.all([mutate(practiceKey(songId)), mutate(MY_PRACTICE_KEY), refreshLibrary()]);
  return entry;
}

const MY_PRACTICE_KEY = '/api/practice';

/** The whole log of the person signed in, across their songs (the weekly summary reads it). */
export function useMyPractice() {
  const { data, error } = useSWR<{ entries: PracticeLogEntry[] }>(MY_PRACTICE_KEY, fetcher);
  return { entries: data?.entries, error };
}

/** The whole log as a CSV file: the server sends it as an attachment, so the page stays where it is. */
export function downloadPracticeLog() {
  const url = `${apiBase}/api/practice/export`;
  if (Platform.OS === 'web') window.location.assign(url);
  else void Linking.openURL(url);
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

// ── Rubato and ritardando marks ──────────────────────────────────────────────────────────────────────

const tempoMarksKey = (recordingId: string) => `/api/recordings/${recordingId}/tempo-marks`;

export function useTempoMarks(recordingId: string | undefined) {
  const { data, error } = useSWR<{ marks: TempoMark[] }>(recordingId ? tempoMarksKey(recordingId) : null, fetcher);
  return { marks: data?.marks, error };
}

/** The marks of several recordings at once (the song's comparison and trend), by recording id. */
export function useTempoMarksOf(recordingIds: string[]) {
  const { data } = useSWR(recordingIds.length ? ['tempo-marks', ...recordingIds] : null, async () => {
    const lists = await Promise.all(
      recordingIds.map((id) => fetcher<{ marks: TempoMark[] }>(tempoMarksKey(id)).then((d) => d.marks)),
    );
    return new Map(recordingIds.map((id, i) => [id, lists[i]!]));
  });
  return data;
}

export async function addTempoMark(recordingId: string, input: TempoMarkInput) {
  await apiFetch(tempoMarksKey(recordingId), { body: input });
  await mutate(tempoMarksKey(recordingId));
}

export async function removeTempoMark(recordingId: string, markId: string) {
  await apiFetch(`/api/tempo-marks/${markId}`, { method: 'DELETE' });
  await mutate(tempoMarksKey(recordingId));
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
  await Promise.all([mutate(`/api/songs/${songId}`), mutate('/api/songs')]);
}

export async function changeSong(id: string, patch: SongPatch) {
  await apiFetch(`/api/songs/${id}`, { method: 'PATCH', body: patch });
  await Promise.all([mutate(`/api/songs/${id}`), refreshLibrary()]);
}

/** Deletes the song with its recordings, passages, candidates and log. */
export async function deleteSong(id: string) {
  await apiFetch(`/api/songs/${id}`, { method: 'DELETE' });
  await refreshLibrary();
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
export async function setPassageTempos(p: Pick<Passage, 'id' | 'songId'>, tempos: SongTempos) {
  const next = await apiFetch<Passage>(`/api/passages/${p.id}/tempos`, { method: 'PATCH', body: tempos });
  await mutate(passagesKey(p.songId));
  return next;
}

export async function removePassage(p: Passage) {
  await apiFetch(`/api/passages/${p.id}`, { method: 'DELETE' });
  await mutate(passagesKey(p.songId));
}

// ── Set lists: songs in playing order at their chosen tempos ─────────────────────────────────────────

export function useSetLists() {
  const { data, error, isLoading } = useSWR<{ setLists: SetListDto[] }>('/api/set-lists', fetcher);
  return { setLists: data?.setLists, error, isLoading };
}

export function useSetList(id: string | undefined) {
  const { data, error, isLoading } = useSWR<SetListDto>(id ? `/api/set-lists/${id}` : null, fetcher, {
    shouldRetryOnError: false,
  });
  return { setList: data, error, isLoading };
}

export async function createSetList(name: string, songIds: string[] = []) {
  const list = await apiFetch<SetListDto>('/api/set-lists', { body: { name, songIds } });
  await mutate('/api/set-lists');
  return list;
}

/** A new name or a new order (the whole order); the answer is the list as the server now has it. */
export async function changeSetList(id: string, patch: { name?: string; songIds?: string[] }) {
  const list = await apiFetch<SetListDto>(`/api/set-lists/${id}`, { method: 'PATCH', body: patch });
  await mutate(`/api/set-lists/${id}`, list, { revalidate: false });
  await mutate('/api/set-lists');
  return list;
}

export async function deleteSetList(id: string) {
  await apiFetch(`/api/set-lists/${id}`, { method: 'DELETE' });
  await mutate('/api/set-lists');
}
