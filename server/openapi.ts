// The API described: an OpenAPI 3.1 document built from the zod schemas in shared/ (the ones the routes parse
// and answer with), and the router that serves it. Every route is registered here, in one place; a test
// checks the list against the routes the app really mounts (server/route-table.ts).
import { Router } from 'express';
import swaggerUi from 'swagger-ui-express';
import { OpenAPIRegistry, OpenApiGeneratorV31, type ResponseConfig } from '@asteasolutions/zod-to-openapi';
import { z, type ZodType } from 'zod';
import {
  ApiErrorSchema,
  CandidateInputSchema,
  CandidateListSchema,
  CandidatePatchSchema,
  CandidateSchema,
  CaughtMailListSchema,
  ChooseTempoSchema,
  HealthSchema,
  InvitationListSchema,
  InvitationSchema,
  InviteStudentSchema,
  MeSchema,
  NoteInputSchema,
  NoteListSchema,
  NotePatchSchema,
  NoteReplySchema,
  NoteSchema,
  PreferencesSchema,
  ReplyInputSchema,
  TempoMarkInputSchema,
  TempoMarkListSchema,
  TempoMarkSchema,
  PassageInputSchema,
  PassageListSchema,
  PassagePatchSchema,
  PassageSchema,
  PeaksSchema,
  PracticeEntryListSchema,
  PracticeLogSchema,
  PracticeEntrySchema,
  PracticeInputSchema,
  ReceivedInvitationListSchema,
  ReceivedInvitationSchema,
  RecordingListSchema,
  RecordingPatchSchema,
  RecordingSchema,
  RecordingUploadFieldsSchema,
  RoleChangeSchema,
  type Role,
  SongInputSchema,
  SongListSchema,
  SongListQuerySchema,
  SongPatchSchema,
  SetListInputSchema,
  SetListListSchema,
  SetListPatchSchema,
  SetListSchema,
  SongSchema,
  SongTemposSchema,
  StudentListSchema,
  TeacherListSchema,
  TeacherSchema,
  UserListSchema,
  UserSummarySchema,
} from '@/shared/schemas';

const { version } = require('../package.json') as { version: string };

/** better-auth's cookie (its default prefix; `__Secure-` is put in front of it when the site is served over https). */
export const SESSION_COOKIE = 'better-auth.session_token';
const BETTER_AUTH_DOCS = 'https://www.better-auth.com/docs/concepts/api';

/** Who may call an operation: anyone, anyone signed in, or signed in with one of these roles. */
type Access = 'public' | 'signed-in' | Role[];

interface Operation {
  method: 'get' | 'post' | 'patch' | 'delete';
  /** OpenAPI templating (`{id}`), the same parameter names as the Express route. */
  path: string;
  summary: string;
  tag: string;
  access: Access;
  description?: string;
  /** The schema the route parses its body with. */
  body?: ZodType;
  /** How the body is sent; JSON unless said otherwise. */
  bodyType?: 'application/json' | 'multipart/form-data';
  query?: z.ZodObject;
  /** Success responses (errors are added from `errors` and what `access`, `body` and the path imply). */
  ok: Record<number, ResponseConfig>;
  /** Error statuses beyond the implied ones (400/413 with a body, 401/403 from access, 404 with a path parameter). */
  errors?: number[];
}

/** What each error status means in this API (DEVELOPERS.md, Conventions; server/http.ts). */
const ERROR_MEANINGS: Record<number, string> = {
  400: 'The body or a parameter is invalid; `error.field` names the first offending field, `error.issues` lists them all.',
  401: 'Not signed in (no valid session cookie).',
  403: 'Signed in, but without a role this needs, or not the account this was meant for.',
  404: 'No such thing, or it belongs to someone else (the API does not say which).',
  409: 'The thing is not in a state that allows this.',
  410: 'Gone: the invitation expired, was withdrawn or was already answered.',
  413: 'The body or the uploaded file is over the size or duration limit.',
  415: 'The upload is not audio Tactus can read (MP3, WAV, FLAC, OGG or M4A).',
  416: 'The Range header cannot be served (one bytes range within the file).',
  422: 'The upload took too long to check (it may be damaged).',
  503: 'The database cannot be reached just now, or too many uploads are being checked (see Retry-After where given).',
  507: 'The server has run out of storage space; the upload was not kept.',
};

const json = (description: string, schema: ZodType): ResponseConfig => ({
  description,
  content: { 'application/json': { schema } },
});
const noContent = (description: string): ResponseConfig => ({ description });

/** Every route of our own (better-auth's are in registerAuth); `devTools` adds the development helpers. */
function operations(s: ReturnType<typeof namedSchemas>, devTools: boolean): Operation[] {
  const ops: Operation[] = [
    // ── Service ──
    {
      method: 'get',
      path: '/api/health',
      tag: 'service',
      access: 'public',
      summary: 'Is the server up, and its database',
      ok: { 200: json('Up, database reachable.', s.Health), 503: json('Degraded: the database is down.', s.Health) },
    },
    {
      method: 'get',
      path: '/api/openapi.json',
      tag: 'service',
      access: 'public',
      summary: 'This document',
      ok: { 200: json('The OpenAPI document of this server.', z.record(z.string(), z.unknown())) },
    },
    // ── Who is asking ──
    {
      method: 'get',
      path: '/api/me',
      tag: 'account',
      access: 'signed-in',
      summary: 'The signed-in user',
      ok: { 200: json('The user.', s.Me) },
    },

    {
      method: 'get',
      path: '/api/me/preferences',
      tag: 'account',
      access: 'signed-in',
      summary: 'My settings',
      ok: { 200: json('My settings.', s.Preferences) },
    },
    {
      method: 'patch',
      path: '/api/me/preferences',
      tag: 'account',
      access: 'signed-in',
      summary: 'Change my settings (the e-mail digest of new notes)',
      body: s.Preferences.partial(),
      ok: { 200: json('My settings as they are now.', s.Preferences) },
    },

    // ── Songs ──
    {
      method: 'get',
      path: '/api/songs',
      tag: 'songs',
      access: 'signed-in',
      summary: 'My songs (the library), searched, sorted and filtered',
      description:
        '`q` finds words in the title or composer/artist; `sort` orders by title (A–Z), last practised (most recent ' +
        'first), chosen tempo (slowest first) or progress to goal (closest first), songs without that value last; ' +
        '`status=ready` keeps the songs whose working tempo has reached the goal tempo, `learning` the others.',
      query: SongListQuerySchema,
      ok: { 200: json('The songs I own that match.', s.SongList) },
      errors: [400],
    },
    {
      method: 'post',
      path: '/api/songs',
      tag: 'songs',
      access: 'signed-in',
      summary: 'Add a song',
      body: s.SongInput,
      ok: { 201: json('The new song.', s.Song) },
    },
    {
      method: 'get',
      path: '/api/songs/{id}',
      tag: 'songs',
      access: 'signed-in',
      summary: 'One song',
      description: 'Its owner, the owner’s teachers and admins may read it.',
      ok: { 200: json('The song.', s.Song) },
    },
    {
      method: 'patch',
      path: '/api/songs/{id}',
      tag: 'songs',
      access: 'signed-in',
      summary: 'Change a song (owner only)',
      body: s.SongPatch,
      ok: { 200: json('The song as it is now.', s.Song) },
    },
    {
      method: 'patch',
      path: '/api/songs/{id}/tempos',
      tag: 'songs',
      access: 'signed-in',
      summary: 'Set the working and goal tempo (owner or linked teacher)',
      description:
        'The song records who set each tempo and when, and keeps the working tempo a change replaced: ' +
        '`undoWorking: true` puts it back with who set it (409 when there is nothing to undo).',
      body: s.SongTempos,
      ok: { 200: json('The song as it is now.', s.Song) },
      errors: [409],
    },
    {
      method: 'delete',
      path: '/api/songs/{id}',
      tag: 'songs',
      access: 'signed-in',
      summary: 'Delete a song with its recordings (owner only)',
      ok: { 204: noContent('Deleted, stored files included.') },
    },

    // ── Recordings ──
    {
      method: 'get',
      path: '/api/songs/{songId}/recordings',
      tag: 'recordings',
      access: 'signed-in',
      summary: 'The recordings of a song',
      ok: { 200: json('Newest first, each with its analysis when done.', s.RecordingList) },
    },
    {
      method: 'post',
      path: '/api/songs/{songId}/recordings',
      tag: 'recordings',
      access: 'signed-in',
      summary: 'Upload a recording (owner only)',
      description:
        'Multipart form: the file in the field `file`, the text fields as described. The analysis runs in the background; poll the recording for its status.',
      bodyType: 'multipart/form-data',
      body: RecordingUploadFieldsSchema.extend({
        file: z.string().meta({ format: 'binary', description: 'The audio file: MP3, WAV, FLAC, OGG or M4A.' }),
      }),
      ok: { 201: json('Stored; its analysis is queued.', s.Recording) },
      errors: [413, 415, 422, 507],
    },
    {
      method: 'get',
      path: '/api/recordings/{id}',
      tag: 'recordings',
      access: 'signed-in',
      summary: 'One recording',
      ok: { 200: json('The recording.', s.Recording) },
    },
    {
      method: 'patch',
      path: '/api/recordings/{id}',
      tag: 'recordings',
      access: 'signed-in',
      summary: 'Label it, correct its tempo or first beat (owner only)',
      body: s.RecordingPatch,
      ok: { 200: json('The recording as it is now.', s.Recording) },
    },
    {
      method: 'delete',
      path: '/api/recordings/{id}',
      tag: 'recordings',
      access: 'signed-in',
      summary: 'Delete a recording and its file (owner only)',
      ok: { 204: noContent('Deleted.') },
    },
    {
      method: 'get',
      path: '/api/recordings/{id}/peaks',
      tag: 'recordings',
      access: 'signed-in',
      summary: 'The waveform overview',
      ok: { 200: json('Minimum and maximum per bucket.', s.Peaks) },
      errors: [409],
    },
    {
      method: 'get',
      path: '/api/recordings/{id}/audio',
      tag: 'recordings',
      access: 'signed-in',
      summary: 'The stored audio file',
      description: 'Answers HTTP ranges (RFC 9110 §14), so a player can seek without downloading the whole file.',
      ok: {
        200: {
          description: 'The whole file.',
          content: { 'audio/*': { schema: { type: 'string', format: 'binary' } } },
        },
        206: {
          description: 'The requested bytes range.',
          content: { 'audio/*': { schema: { type: 'string', format: 'binary' } } },
        },
      },
      errors: [416],
    },
    {
      method: 'post',
      path: '/api/recordings/{id}/retry',
      tag: 'recordings',
      access: 'signed-in',
      summary: 'Analyse a failed recording again (owner only)',
      ok: { 202: json('Queued again.', s.Recording) },
      errors: [409],
    },

    // ── Notes ──
    {
      method: 'get',
      path: '/api/recordings/{recordingId}/notes',
      tag: 'notes',
      access: 'signed-in',
      summary: 'The notes on a recording',
      ok: { 200: json('In time order, each with its replies.', s.NoteList) },
    },
    {
      method: 'post',
      path: '/api/recordings/{recordingId}/notes',
      tag: 'notes',
      access: 'signed-in',
      summary: 'Write a note at a moment or on a passage (owner or linked teacher)',
      body: s.NoteInput,
      ok: { 201: json('The new note.', s.Note) },
    },
    {
      method: 'post',
      path: '/api/notes/{id}/replies',
      tag: 'notes',
      access: 'signed-in',
      summary: 'Reply to a note (owner or linked teacher)',
      body: s.ReplyInput,
      ok: { 201: json('The reply.', s.NoteReply) },
    },
    {
      method: 'patch',
      path: '/api/notes/{id}',
      tag: 'notes',
      access: 'signed-in',
      summary: 'Resolve or reopen a note (either side); change its words (its author only)',
      body: s.NotePatch,
      ok: { 200: json('The note as it is now.', s.NoteReply.extend({ resolved: z.boolean() })) },
      errors: [403],
    },
    {
      method: 'delete',
      path: '/api/notes/{id}',
      tag: 'notes',
      access: 'signed-in',
      summary: 'Delete a note with its replies, or a reply (its author only)',
      ok: { 204: noContent('Deleted.') },
      errors: [403],
    },

    // ── Intended tempo changes ──
    {
      method: 'get',
      path: '/api/recordings/{recordingId}/tempo-marks',
      tag: 'recordings',
      access: 'signed-in',
      summary: 'The stretches of a recording marked rubato or ritardando (left out of the steadiness report)',
      ok: { 200: json('In time order.', s.TempoMarkList) },
    },
    {
      method: 'post',
      path: '/api/recordings/{recordingId}/tempo-marks',
      tag: 'recordings',
      access: 'signed-in',
      summary: 'Mark a stretch as rubato or ritardando (owner only)',
      body: s.TempoMarkInput,
      ok: { 201: json('The new mark.', s.TempoMark) },
    },
    {
      method: 'delete',
      path: '/api/tempo-marks/{id}',
      tag: 'recordings',
      access: 'signed-in',
      summary: 'Remove a rubato or ritardando mark (owner only)',
      ok: { 204: noContent('Removed.') },
    },

    // ── Tempos and practice ──
    {
      method: 'get',
      path: '/api/songs/{songId}/candidates',
      tag: 'tempos',
      access: 'signed-in',
      summary: 'The candidate tempos of a song',
      ok: { 200: json('The candidates.', s.CandidateList) },
    },
    {
      method: 'post',
      path: '/api/songs/{songId}/candidates',
      tag: 'tempos',
      access: 'signed-in',
      summary: 'Add a candidate tempo (owner only)',
      body: s.CandidateInput,
      ok: { 201: json('The new candidate.', s.Candidate) },
    },
    {
      method: 'post',
      path: '/api/songs/{songId}/choose',
      tag: 'tempos',
      access: 'signed-in',
      summary: 'Choose the tempo of a song, with a note (owner only)',
      body: s.ChooseTempo,
      ok: { 200: json('The song with its chosen tempo.', s.Song) },
    },
    {
      method: 'get',
      path: '/api/songs/{songId}/practice',
      tag: 'tempos',
      access: 'signed-in',
      summary: 'The practice log of a song',
      ok: { 200: json('Its practice entries.', s.PracticeEntryList) },
    },
    {
      method: 'post',
      path: '/api/songs/{songId}/practice',
      tag: 'tempos',
      access: 'signed-in',
      summary: 'Log a practice entry (owner only)',
      description:
        'By hand or from a step-up run. Logging never changes a working tempo: the app offers the raise and sets ' +
        'it through the tempos routes, so the player can undo it. A session logged later gives `practisedAt` ' +
        '(not in the future, at most a year back; the app sends noon of the day in the player’s time zone): the ' +
        'entry’s `createdAt` is then that instant and `loggedAt` when it was logged.',
      body: s.PracticeInput,
      ok: { 201: json('The new entry.', s.PracticeEntry) },
    },
    {
      method: 'get',
      path: '/api/practice',
      tag: 'tempos',
      access: 'signed-in',
      summary: 'The whole practice log of the person asking, across their songs',
      ok: { 200: json('Newest first, each entry with its song’s title.', s.PracticeLog) },
    },
    {
      method: 'get',
      path: '/api/practice/export',
      tag: 'tempos',
      access: 'signed-in',
      summary: 'The whole practice log of the person asking, as CSV',
      description:
        'RFC 4180: a header row, comma-separated, fields with commas, quotes or line breaks quoted, CRLF line ends; ' +
        'dates in ISO 8601 (UTC). Sent as an attachment.',
      ok: {
        200: {
          description: 'Oldest first.',
          content: { 'text/csv': { schema: { type: 'string' } } },
        },
      },
    },
    // ── Passages ──
    {
      method: 'get',
      path: '/api/songs/{songId}/passages',
      tag: 'passages',
      access: 'signed-in',
      summary: 'The passages of a song’s recordings',
      ok: { 200: json('By recording, then by where they start.', s.PassageList) },
    },
    {
      method: 'post',
      path: '/api/songs/{songId}/passages',
      tag: 'passages',
      access: 'signed-in',
      summary: 'Save a passage of one of the song’s recordings (owner only)',
      body: s.PassageInput,
      ok: { 201: json('The new passage.', s.Passage) },
    },
    {
      method: 'patch',
      path: '/api/passages/{id}',
      tag: 'passages',
      access: 'signed-in',
      summary: 'Rename, move or retime a passage (owner only)',
      body: s.PassagePatch,
      ok: { 200: json('The passage as it is now.', s.Passage) },
    },
    {
      method: 'patch',
      path: '/api/passages/{id}/tempos',
      tag: 'passages',
      access: 'signed-in',
      summary: 'Set a passage’s working and goal tempo (owner or linked teacher)',
      description: 'As for a song: `undoWorking: true` puts back the working tempo the last change replaced.',
      body: s.SongTempos,
      ok: { 200: json('The passage as it is now.', s.Passage) },
      errors: [409],
    },
    {
      method: 'delete',
      path: '/api/passages/{id}',
      tag: 'passages',
      access: 'signed-in',
      summary: 'Delete a passage (its practice entries keep what was played)',
      ok: { 204: noContent('Deleted.') },
    },
    {
      method: 'patch',
      path: '/api/candidates/{id}',
      tag: 'tempos',
      access: 'signed-in',
      summary: 'Change a candidate tempo (owner only)',
      body: s.CandidatePatch,
      ok: { 200: json('The candidate as it is now.', s.Candidate) },
    },
    {
      method: 'delete',
      path: '/api/candidates/{id}',
      tag: 'tempos',
      access: 'signed-in',
      summary: 'Delete a candidate tempo (owner only)',
      ok: { 204: noContent('Deleted.') },
    },

    // ── Set lists ──
    {
      method: 'get',
      path: '/api/set-lists',
      tag: 'set lists',
      access: 'signed-in',
      summary: 'My set lists',
      ok: { 200: json('Newest first.', s.SetListList) },
    },
    {
      method: 'post',
      path: '/api/set-lists',
      tag: 'set lists',
      access: 'signed-in',
      summary: 'A new set list of my songs in playing order',
      body: s.SetListInput,
      ok: { 201: json('The set list with each song’s click tempo and duration, and the total.', s.SetList) },
    },
    {
      method: 'get',
      path: '/api/set-lists/{id}',
      tag: 'set lists',
      access: 'signed-in',
      summary: 'One set list',
      ok: { 200: json('The set list.', s.SetList) },
    },
    {
      method: 'patch',
      path: '/api/set-lists/{id}',
      tag: 'set lists',
      access: 'signed-in',
      summary: 'Rename it or put its songs in a new order (owner only)',
      body: s.SetListPatch,
      ok: { 200: json('The set list as it is now.', s.SetList) },
    },
    {
      method: 'delete',
      path: '/api/set-lists/{id}',
      tag: 'set lists',
      access: 'signed-in',
      summary: 'Delete a set list (owner only)',
      ok: { 204: noContent('Deleted; the songs stay.') },
    },

    // ── Teaching ──
    {
      method: 'get',
      path: '/api/students',
      tag: 'studio',
      access: ['teacher', 'admin'],
      summary: 'My students',
      description:
        'Each with their songs, recent takes and what waits for my answer: takes of the last two weeks I have not ' +
        'written on, and open notes on their recordings whose last word is theirs.',
      ok: { 200: json('My students.', s.StudentList) },
    },
    {
      method: 'delete',
      path: '/api/students/{studentId}',
      tag: 'studio',
      access: ['teacher', 'admin'],
      summary: 'Remove a student',
      ok: { 204: noContent('Removed.') },
    },

    {
      method: 'get',
      path: '/api/teachers',
      tag: 'studio',
      access: 'signed-in',
      summary: 'My teachers (invitations I accepted)',
      ok: { 200: json('My teachers.', s.TeacherList) },
    },
    {
      method: 'delete',
      path: '/api/teachers/{teacherId}',
      tag: 'studio',
      access: 'signed-in',
      summary: 'End the link with a teacher',
      description: 'The teacher loses access to my songs at once.',
      ok: { 204: noContent('Ended.') },
    },
    {
      method: 'post',
      path: '/api/invitations',
      tag: 'studio',
      access: ['teacher', 'admin'],
      summary: 'Invite a student by e-mail',
      description:
        'Mails a one-time link that works for 7 days. The answer is the same whether or not an account uses the address.',
      body: s.InviteStudent,
      ok: { 202: json('Sent.', s.Invitation) },
    },
    {
      method: 'get',
      path: '/api/invitations',
      tag: 'studio',
      access: ['teacher', 'admin'],
      summary: 'My pending invitations',
      ok: { 200: json('Not yet answered, newest first (expired ones say so).', s.InvitationList) },
    },
    {
      method: 'delete',
      path: '/api/invitations/{id}',
      tag: 'studio',
      access: ['teacher', 'admin'],
      summary: 'Withdraw a pending invitation',
      ok: { 204: noContent('Withdrawn: the link no longer works.') },
    },
    {
      method: 'get',
      path: '/api/invitations/token/{token}',
      tag: 'studio',
      access: 'public',
      summary: 'The invitation a mailed link points at',
      ok: {
        200: json('Who invites, to which address, and whether the signed-in account may answer.', s.ReceivedInvitation),
      },
    },
    {
      method: 'get',
      path: '/api/invitations/received',
      tag: 'studio',
      access: 'signed-in',
      summary: 'Pending invitations to my address',
      ok: { 200: json('Newest first.', s.ReceivedInvitationList) },
    },
    {
      method: 'post',
      path: '/api/invitations/{id}/accept',
      tag: 'studio',
      access: 'signed-in',
      summary: 'Accept an invitation (the invited address only)',
      ok: { 200: json('The teacher now linked.', s.Teacher) },
      errors: [403, 410],
    },
    {
      method: 'post',
      path: '/api/invitations/{id}/decline',
      tag: 'studio',
      access: 'signed-in',
      summary: 'Decline an invitation (the invited address only)',
      ok: { 204: noContent('Declined.') },
      errors: [403, 410],
    },

    // ── Administration ──
    {
      method: 'get',
      path: '/api/admin/users',
      tag: 'admin',
      access: ['admin'],
      summary: 'Every user',
      ok: { 200: json('Every user, oldest first.', s.UserList) },
    },
    {
      method: 'patch',
      path: '/api/admin/users/{id}/role',
      tag: 'admin',
      access: ['admin'],
      summary: 'Change a user’s role',
      body: s.RoleChange,
      ok: { 200: json('The user as it is now.', s.UserSummary) },
    },
  ];

  if (devTools) {
    ops.push(
      {
        method: 'get',
        path: '/api/dev/mail',
        tag: 'development',
        access: 'public',
        summary: 'Caught mail (development only)',
        query: z.object({ to: z.string().optional().meta({ description: 'Only mail to this address.' }) }),
        ok: { 200: json('Every message the server sent, newest first.', s.CaughtMailList) },
      },
      {
        method: 'get',
        path: '/api/docs',
        tag: 'development',
        access: 'public',
        summary: 'This document as a readable page (development only)',
        ok: {
          200: {
            description: 'The reference page (its scripts and styles are served below /api/docs/).',
            content: { 'text/html': { schema: { type: 'string' } } },
          },
        },
      },
    );
  }
  return ops;
}

/**
 * The shared schemas under the names they get in components/schemas. zod's `.meta({ id })` names a copy
 * (shared/ stays untouched); the library's `.openapi()` would need zod extended before shared/ is loaded.
 */
function namedSchemas() {
  const r = <T extends ZodType>(name: string, schema: T) => schema.meta({ id: name }) as T;
  return {
    ApiError: r('ApiError', ApiErrorSchema),
    Health: r('Health', HealthSchema),
    Me: r('Me', MeSchema),
    Preferences: r('Preferences', PreferencesSchema),
    Note: r('Note', NoteSchema),
    NoteReply: r('NoteReply', NoteReplySchema),
    NoteInput: r('NoteInput', NoteInputSchema),
    NotePatch: r('NotePatch', NotePatchSchema),
    ReplyInput: r('ReplyInput', ReplyInputSchema),
    NoteList: r('NoteList', NoteListSchema),
    TempoMark: r('TempoMark', TempoMarkSchema),
    TempoMarkInput: r('TempoMarkInput', TempoMarkInputSchema),
    TempoMarkList: r('TempoMarkList', TempoMarkListSchema),
    Song: r('Song', SongSchema),
    SongInput: r('SongInput', SongInputSchema),
    SongPatch: r('SongPatch', SongPatchSchema),
    SongList: r('SongList', SongListSchema),
    SongTempos: r('SongTempos', SongTemposSchema),
    SetList: r('SetList', SetListSchema),
    SetListInput: r('SetListInput', SetListInputSchema),
    SetListPatch: r('SetListPatch', SetListPatchSchema),
    SetListList: r('SetListList', SetListListSchema),
    Recording: r('Recording', RecordingSchema),
    RecordingList: r('RecordingList', RecordingListSchema),
    RecordingPatch: r('RecordingPatch', RecordingPatchSchema),
    Peaks: r('Peaks', PeaksSchema),
    Candidate: r('Candidate', CandidateSchema),
    CandidateInput: r('CandidateInput', CandidateInputSchema),
    CandidatePatch: r('CandidatePatch', CandidatePatchSchema),
    CandidateList: r('CandidateList', CandidateListSchema),
    ChooseTempo: r('ChooseTempo', ChooseTempoSchema),
    PracticeInput: r('PracticeInput', PracticeInputSchema),
    PracticeEntry: r('PracticeEntry', PracticeEntrySchema),
    PracticeEntryList: r('PracticeEntryList', PracticeEntryListSchema),
    PracticeLog: r('PracticeLog', PracticeLogSchema),
    Passage: r('Passage', PassageSchema),
    PassageInput: r('PassageInput', PassageInputSchema),
    PassagePatch: r('PassagePatch', PassagePatchSchema),
    PassageList: r('PassageList', PassageListSchema),
    StudentList: r('StudentList', StudentListSchema),
    InviteStudent: r('InviteStudent', InviteStudentSchema),
    Invitation: r('Invitation', InvitationSchema),
    InvitationList: r('InvitationList', InvitationListSchema),
    ReceivedInvitation: r('ReceivedInvitation', ReceivedInvitationSchema),
    ReceivedInvitationList: r('ReceivedInvitationList', ReceivedInvitationListSchema),
    Teacher: r('Teacher', TeacherSchema),
    TeacherList: r('TeacherList', TeacherListSchema),
    UserSummary: r('UserSummary', UserSummarySchema),
    UserList: r('UserList', UserListSchema),
    RoleChange: r('RoleChange', RoleChangeSchema),
    CaughtMailList: r('CaughtMailList', CaughtMailListSchema),
  };
}

/** better-auth's own endpoints that the app uses (client/auth.ts, the mails' links); its handler serves /api/auth/*. */
function registerAuth(registry: OpenAPIRegistry) {
  const AuthError = z
    .object({ code: z.string().optional(), message: z.string() })
    .meta({ id: 'AuthError', description: 'better-auth’s error shape (not ours).' });
  const answer = z
    .record(z.string(), z.unknown())
    .meta({ description: 'better-auth’s answer; see its documentation.' });
  const externalDocs = { description: 'better-auth endpoints', url: BETTER_AUTH_DOCS };
  const errors = {
    400: { description: 'Refused by better-auth.', content: { 'application/json': { schema: AuthError } } },
  };
  const post = (path: string, summary: string, body: z.ZodObject, extra: Record<string, ResponseConfig> = {}) =>
    registry.registerPath({
      method: 'post',
      path: `/api/auth${path}`,
      tags: ['auth'],
      summary,
      externalDocs,
      request: { body: { required: true, content: { 'application/json': { schema: body } } } },
      responses: {
        200: { description: 'Done.', content: { 'application/json': { schema: answer } } },
        ...errors,
        ...extra,
      },
    });
  const callbackURL = z.string().optional().meta({ description: 'Where the confirmation link leads afterwards.' });
  post(
    '/sign-up/email',
    'Create an account; a confirmation link is mailed',
    z.object({ name: z.string(), email: z.string(), password: z.string(), callbackURL }),
  );
  post(
    '/sign-in/email',
    'Sign in; sets the session cookie',
    z.object({ email: z.string(), password: z.string(), callbackURL, rememberMe: z.boolean().optional() }),
    {
      401: { description: 'Wrong e-mail or password.', content: { 'application/json': { schema: AuthError } } },
      403: {
        description: 'The e-mail is not confirmed yet (a new link is mailed).',
        content: { 'application/json': { schema: AuthError } },
      },
    },
  );
  post('/sign-out', 'Sign out; clears the session cookie', z.object({}));
  post(
    '/request-password-reset',
    'Mail a password reset link',
    z.object({ email: z.string(), redirectTo: z.string().optional() }),
  );
  post(
    '/reset-password',
    'Set a new password with the token from the link',
    z.object({ newPassword: z.string(), token: z.string() }),
  );
  registry.registerPath({
    method: 'get',
    path: '/api/auth/verify-email',
    tags: ['auth'],
    summary: 'Confirm an e-mail address (the link in the mail)',
    externalDocs,
    request: { query: z.object({ token: z.string(), callbackURL: z.string().optional() }) },
    responses: { 302: { description: 'Confirmed; on to callbackURL.' }, ...errors },
  });
  registry.registerPath({
    method: 'get',
    path: '/api/auth/get-session',
    tags: ['auth'],
    summary: 'The current session, or null',
    externalDocs,
    responses: {
      200: {
        description: 'The session and its user, or null.',
        content: { 'application/json': { schema: answer.nullable() } },
      },
    },
  });
}

/** Builds the whole document. `devTools` says whether the development helpers are mounted (config.devTools). */
export function buildOpenApiDocument(opts: { devTools: boolean }) {
  const registry = new OpenAPIRegistry();
  registry.registerComponent('securitySchemes', 'sessionCookie', {
    type: 'apiKey',
    in: 'cookie',
    name: SESSION_COOKIE,
    description: 'Set by POST /api/auth/sign-in/email. On https its name starts with `__Secure-`.',
  });
  const s = namedSchemas();
  registerAuth(registry);

  for (const op of operations(s, opts.devTools)) {
    const pathParams = [...op.path.matchAll(/\{(\w+)\}/g)].map((m) => m[1]!);
    const errorStatuses = new Set(op.errors ?? []);
    if (op.body) errorStatuses.add(400);
    // express.json's 1 MB limit (server/app.ts) answers 413 before the route sees the body.
    if (op.body && !op.bodyType) errorStatuses.add(413);
    if (op.access !== 'public') errorStatuses.add(401);
    if (Array.isArray(op.access)) errorStatuses.add(403);
    if (pathParams.length) errorStatuses.add(404);
    // All but the document, its page and the caught mail need the database (server/http.ts,
    // isDatabaseUnreachable); an upload may also find the checks busy.
    if (!/^\/api\/(openapi\.json|docs|dev\/)/.test(op.path)) errorStatuses.add(503);
    const errorResponses = Object.fromEntries(
      [...errorStatuses].sort((a, b) => a - b).map((status) => [status, json(ERROR_MEANINGS[status]!, s.ApiError)]),
    );
    registry.registerPath({
      method: op.method,
      path: op.path,
      summary: op.summary,
      description: op.description,
      tags: [op.tag],
      ...(op.access === 'public' ? {} : { security: [{ sessionCookie: [] }] }),
      // Which roles may call it; absent means any signed-in user (or anyone, without `security`).
      ...(Array.isArray(op.access) ? { 'x-roles': op.access } : {}),
      request: {
        params: pathParams.length ? z.object(Object.fromEntries(pathParams.map((p) => [p, z.string()]))) : undefined,
        query: op.query,
        body: op.body && {
          required: true,
          content: { [op.bodyType ?? 'application/json']: { schema: op.body } },
        },
      },
      responses: { ...op.ok, ...errorResponses },
    });
  }

  return new OpenApiGeneratorV31(registry.definitions).generateDocument({
    openapi: '3.1.0',
    info: {
      title: 'Tactus API',
      version,
      description:
        'Songs, recordings and their tempo analysis, candidate and chosen tempos, practice logs, studios. ' +
        'Every error of our own is `{ error: { code, message, field?, requestId } }` (requestId = the X-Request-Id header); better-auth’s endpoints under /api/auth answer in its own shape, except where our guards refuse first (413, 400, 429). ' +
        'Sign-in, sign-up, account mails, invitations and uploads are rate-limited: 429 with Retry-After. A POST, PATCH, PUT or DELETE with a foreign Origin gets 403. ' +
        'An operation with `security` needs the session cookie; `x-roles` names the roles it allows when not every signed-in user may call it.',
    },
    tags: [
      {
        name: 'auth',
        description: 'Sign-up, sign-in, sessions and password reset, served by better-auth.',
        externalDocs: { url: BETTER_AUTH_DOCS },
      },
    ],
  });
}

export type OpenApiDocument = ReturnType<typeof buildOpenApiDocument>;

/** Serves the document at /openapi.json and, when `referencePage` is on, the readable page at /docs (mounted at /api). */
export function openApiRouter(document: OpenApiDocument, opts: { referencePage: boolean }) {
  const router = Router();
  router.get('/openapi.json', (_req, res) => {
    res.json(document);
  });
  if (opts.referencePage) {
    // swagger-ui-express serves its scripts and styles from the installed swagger-ui-dist: nothing from the network.
    router.use('/docs', swaggerUi.serve);
    router.get('/docs', swaggerUi.setup(document, { customSiteTitle: 'Tactus API' }));
  }
  return router;
}
