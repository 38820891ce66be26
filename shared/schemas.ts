// The single source of every API shape: the server validates with these, the client infers its types.
import { z } from 'zod';
import { AnalysisSchema } from './analysis';
// Sets zod's messages to plain words for every schema below (see messages.ts).
import './messages';

export * from './analysis';

export const ROLES = ['player', 'teacher', 'admin'] as const;
export const RoleSchema = z.enum(ROLES);
export type Role = z.infer<typeof RoleSchema>;

/** Tempo in beats per minute. 30–300 covers what the tempo engine reports and what a metronome offers. */
export const BpmSchema = z.number().min(30, 'tempo must be at least 30 BPM').max(300, 'tempo must be at most 300 BPM');

/** A time signature such as 4/4, 3/4, 6/8 or 7/8. */
export const MeterSchema = z
  .string()
  .regex(/^(?:[1-9]|1[0-9])\/(?:2|4|8|16)$/, 'write the time signature like 4/4, 3/4 or 6/8');

export const HealthSchema = z.object({
  status: z.enum(['ok', 'degraded']),
  database: z.enum(['up', 'down']),
  version: z.string(),
});
export type Health = z.infer<typeof HealthSchema>;

export const MeSchema = z.object({
  id: z.string(),
  name: z.string(),
  email: z.string(),
  emailVerified: z.boolean(),
  role: RoleSchema,
});
export type Me = z.infer<typeof MeSchema>;

export const SongInputSchema = z.object({
  title: z.string().trim().min(1, 'give the song a title').max(200),
  composer: z.string().trim().max(200).nullish(),
  /** The musical key as the player writes it ("D minor", "B♭ major"); blank is none. */
  key: z
    .string()
    .trim()
    .max(40, 'use at most 40 characters')
    .transform((v) => v || null)
    .nullish(),
  meter: MeterSchema.optional(),
  goalBpm: BpmSchema.nullish(),
  workingBpm: BpmSchema.nullish(),
  chosenBpm: BpmSchema.nullish(),
  notes: z.string().max(5000).nullish(),
});
export type SongInput = z.infer<typeof SongInputSchema>;
export const SongPatchSchema = SongInputSchema.partial();
export type SongPatch = z.infer<typeof SongPatchSchema>;

/** A person named on something they did (set a tempo, uploaded a reference). */
export const PersonRefSchema = z.object({ id: z.string(), name: z.string() });
/** Who set a working or goal tempo, and when (null: never set, or set before this was recorded). */
const SetBySchema = {
  workingSetBy: PersonRefSchema.nullable(),
  workingSetAt: z.string().nullable(),
  goalSetBy: PersonRefSchema.nullable(),
  goalSetAt: z.string().nullable(),
};

/** What the person asking may do with a song; the screens show only these controls. */
export const SongPermissionsSchema = z.object({
  edit: z.boolean(),
  setTempos: z.boolean(),
  addReference: z.boolean(),
  addTake: z.boolean(),
});
export type SongPermissions = z.infer<typeof SongPermissionsSchema>;

export const SongSchema = z.object({
  id: z.string(),
  /** The owner's name, for a teacher's view ("Ilya's song"). */
  ownerName: z.string(),
  ...SetBySchema,
  permissions: SongPermissionsSchema,
  ownerId: z.string(),
  title: z.string(),
  composer: z.string().nullable(),
  key: z.string().nullable(),
  meter: z.string(),
  goalBpm: z.number().nullable(),
  workingBpm: z.number().nullable(),
  chosenBpm: z.number().nullable(),
  notes: z.string().nullable(),
  chosenNote: z.string().nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Song = z.infer<typeof SongSchema>;
/** Working and goal tempo: the player's own, or set for them by their teacher. */
export const SongTemposSchema = z
  .object({
    workingBpm: BpmSchema.nullable(),
    goalBpm: BpmSchema.nullable(),
    /** Put back the working tempo the last change replaced, with who set it (Undo). */
    undoWorking: z.literal(true),
  })
  .partial()
  .strict()
  .refine((t) => !(t.undoWorking && t.workingBpm !== undefined), {
    message: 'give a working tempo or undo the last change, not both',
    path: ['undoWorking'],
  });
export type SongTempos = z.infer<typeof SongTemposSchema>;

// ── The library: a player's songs, searched, sorted and filtered on the server ─────────────────────

export const LIBRARY_SORTS = ['title', 'lastPractised', 'chosenBpm', 'progress'] as const;
export type LibrarySort = (typeof LIBRARY_SORTS)[number];
/**
 * "Ready to perform": the working tempo has reached the goal tempo. Everything else (no goal yet, or the working
 * tempo still below it) is "learning".
 */
export const LIBRARY_STATUSES = ['learning', 'ready'] as const;
export type LibraryStatus = (typeof LIBRARY_STATUSES)[number];
export const SongListQuerySchema = z
  .object({
    /** Words in the title or the composer/artist. */
    q: z.string().trim().max(200, 'use at most 200 characters').optional(),
    sort: z.enum(LIBRARY_SORTS, { message: `sort by one of: ${LIBRARY_SORTS.join(', ')}` }).default('title'),
    status: z.enum(LIBRARY_STATUSES, { message: 'show learning or ready songs' }).optional(),
  })
  .strict();
export type SongListQuery = z.infer<typeof SongListQuerySchema>;
/**
 * A song as the library lists it: only what the library's screens show (the table, the phone's card, the set
 * list's "Add songs", the practice page), with when it was last practised, its counts and where it stands. The
 * whole song, with its notes, who set its tempos and what the reader may do, is GET /api/songs/:id.
 */
export const SongListItemSchema = SongSchema.pick({
  id: true,
  title: true,
  composer: true,
  key: true,
  meter: true,
  goalBpm: true,
  workingBpm: true,
  chosenBpm: true,
}).extend({
  lastPractisedAt: z.string().nullable(),
  recordingCount: z.number().int(),
  passageCount: z.number().int(),
  /** Working tempo as a share of the goal (1 = reached); null without both. */
  progress: z.number().nullable(),
  ready: z.boolean(),
});
export type SongListItem = z.infer<typeof SongListItemSchema>;
export const SongListSchema = z.object({ songs: z.array(SongListItemSchema) });

export const UserSummarySchema = z.object({
  id: z.string(),
  name: z.string(),
  email: z.string(),
  role: RoleSchema,
  emailVerified: z.boolean(),
  createdAt: z.string(),
});
export type UserSummary = z.infer<typeof UserSummarySchema>;
export const UserListSchema = z.object({ users: z.array(UserSummarySchema) });
export const RoleChangeSchema = z.object({ role: RoleSchema });

/** One song of a student as their teacher's overview shows it: tempos toward the goal, practice, recent takes. */
export const StudentSongSchema = z.object({
  id: z.string(),
  title: z.string(),
  goalBpm: z.number().nullable(),
  workingBpm: z.number().nullable(),
  chosenBpm: z.number().nullable(),
  lastPracticedAt: z.string().nullable(),
  recentTakes: z.array(
    z.object({
      id: z.string(),
      label: z.string().nullable(),
      createdAt: z.string(),
      /** A recent take (see `awaiting`) the teacher asking has not written on yet. */
      awaitingAnswer: z.boolean(),
    }),
  ),
  /** Recordings of the song with open note threads waiting for this teacher (see `awaiting`), and how many each. */
  notesAwaiting: z.array(z.object({ recordingId: z.string(), label: z.string().nullable(), notes: z.number().int() })),
});
export const StudentSchema = z.object({
  id: z.string(),
  name: z.string(),
  email: z.string(),
  songCount: z.number().int(),
  songs: z.array(StudentSongSchema),
  /**
   * What waits for the teacher asking: takes of the last two weeks (since the link) they have not written on,
   * and open note threads on the student's recordings whose last word is the student's and that are this
   * teacher's to answer (they wrote in it, or the student started it after the link and no other teacher wrote).
   */
  awaiting: z.object({ takes: z.number().int(), notes: z.number().int() }),
});
export type Student = z.infer<typeof StudentSchema>;
export const StudentListSchema = z.object({ students: z.array(StudentSchema) });

// ── Invitations between a teacher and a student ────────────────────────────────────────────────────

export const InviteStudentSchema = z
  .object({ email: z.string().trim().toLowerCase().email('enter an e-mail address such as name@example.com') })
  .strict();
export const INVITATION_STATES = ['pending', 'accepted', 'declined', 'withdrawn', 'expired'] as const;
/** An invitation as the teacher who sent it sees it. */
export const InvitationSchema = z.object({
  id: z.string(),
  email: z.string(),
  status: z.enum(INVITATION_STATES),
  expiresAt: z.string(),
  createdAt: z.string(),
});
export type Invitation = z.infer<typeof InvitationSchema>;
export const InvitationListSchema = z.object({ invitations: z.array(InvitationSchema) });
/** An invitation as the invited person sees it (from the mailed link, or listed in the app). */
export const ReceivedInvitationSchema = z.object({
  id: z.string(),
  teacherName: z.string(),
  email: z.string(),
  status: z.enum(INVITATION_STATES),
  expiresAt: z.string(),
  /** Signed in with the invited address: this account may answer. Null when nobody is signed in. */
  forYou: z.boolean().nullable(),
});
export type ReceivedInvitation = z.infer<typeof ReceivedInvitationSchema>;
export const ReceivedInvitationListSchema = z.object({ invitations: z.array(ReceivedInvitationSchema) });
export const TeacherSchema = z.object({ id: z.string(), name: z.string(), email: z.string(), since: z.string() });
export type Teacher = z.infer<typeof TeacherSchema>;
export const TeacherListSchema = z.object({ teachers: z.array(TeacherSchema) });

/** Every error the API sends has this shape; `field` names the offending input when there is one. */
/** A person's name as teachers and students see it. */
export const PersonNameSchema = z.string().trim().min(1, 'enter your name').max(200);
const AvatarUrlSchema = z.url({ protocol: /^https?$/, error: 'enter a web address (https://…)' }).max(2048);

/** better-auth's sign-up body: its own fields are its business; the name (and any picture) are checked first. */
export const SignUpFieldsSchema = z.looseObject({ name: PersonNameSchema, image: AvatarUrlSchema.nullish() });

/** better-auth's update-user body: only the name and the picture can be changed there. */
export const UpdateUserSchema = z
  .strictObject({ name: PersonNameSchema.optional(), image: AvatarUrlSchema.nullable().optional() })
  .refine((b) => b.name !== undefined || b.image !== undefined, 'nothing to change: send a name or a picture');

export const ApiErrorSchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    field: z.string().optional(),
    issues: z.array(z.object({ field: z.string(), message: z.string() })).optional(),
    /** The id of the request in the server's log (also the X-Request-Id header): quote it when reporting a fault. */
    requestId: z.string().optional(),
  }),
});
export type ApiError = z.infer<typeof ApiErrorSchema>;

export const CaughtMailSchema = z.object({
  id: z.string(),
  to: z.array(z.string()),
  from: z.string(),
  subject: z.string(),
  text: z.string(),
  html: z.string().nullable(),
  links: z.array(z.string()),
  receivedAt: z.string(),
});
export type CaughtMail = z.infer<typeof CaughtMailSchema>;
export const CaughtMailListSchema = z.object({ mails: z.array(CaughtMailSchema) });

// ── Recordings and their analysis ────────────────────────────────────────────────────────────────────

/** The metrical level a player hears as the beat, against the one the engine found. */
export const BeatLevelSchema = z.enum(['half', 'as-found', 'double']);
export type BeatLevel = z.infer<typeof BeatLevelSchema>;

export const RecordingKindSchema = z.enum(['reference', 'take'], {
  message: 'choose reference (someone else’s recording) or take (your own)',
});
export type RecordingKind = z.infer<typeof RecordingKindSchema>;

/** The text fields of an upload (multipart); the file itself is the field `file`. */
export const RecordingUploadFieldsSchema = z.object({
  kind: RecordingKindSchema,
  label: z.string().trim().max(200, 'use at most 200 characters').optional(),
});

export const RecordingPatchSchema = z
  .object({
    /** A name of spaces is no name: stored as none, not as an empty string. */
    label: z
      .string()
      .trim()
      .max(200, 'use at most 200 characters')
      .transform((v) => v || null)
      .nullable()
      .optional(),
    correctedBpm: BpmSchema.nullable().optional(),
    beatOffsetSec: z.number().min(0, 'must not be negative').max(3600).nullable().optional(),
    beatLevel: BeatLevelSchema.optional(),
    barOneSec: z
      .number()
      .min(0, 'must not be negative')
      .max(24 * 3600)
      .nullable()
      .optional(),
    /** Half a second either way is far more than any grid is off by; more is a mistake. */
    nudgeMs: z
      .number()
      .int('enter whole milliseconds')
      .min(-500, 'must be at least −500 ms')
      .max(500, 'must be at most 500 ms')
      .optional(),
  })
  .strict();
export type RecordingPatch = z.infer<typeof RecordingPatchSchema>;

export const RecordingSchema = z.object({
  id: z.string(),
  songId: z.string(),
  ownerId: z.string(),
  kind: RecordingKindSchema,
  label: z.string().nullable(),
  originalName: z.string().nullable(),
  format: z.enum(['mp3', 'wav', 'flac', 'ogg', 'm4a']),
  sizeBytes: z.number(),
  durationSec: z.number(),
  status: z.enum(['queued', 'running', 'done', 'failed']),
  progress: z.number(),
  error: z.string().nullable(),
  /** The tempo to use: the player's correction if any, else the analysis's. */
  originalBpm: z.number().nullable(),
  correctedBpm: z.number().nullable(),
  beatOffsetSec: z.number().nullable(),
  beatLevel: BeatLevelSchema,
  barOneSec: z.number().nullable(),
  nudgeMs: z.number(),
  /** The owner's name, for a teacher's view ("Ilya's take"). */
  ownerName: z.string(),
  /** Who uploaded it when not its owner (a teacher's reference); null when the owner did. */
  uploadedBy: PersonRefSchema.nullable(),
  /** What the person asking may do: change and correct it (the owner), write notes on it (owner and teacher). */
  permissions: z.object({ edit: z.boolean(), note: z.boolean() }),
  analysis: AnalysisSchema.nullable(),
  createdAt: z.string(),
});
export type Recording = z.infer<typeof RecordingSchema>;
export const RecordingListSchema = z.object({ recordings: z.array(RecordingSchema) });

export const PeaksSchema = z.object({ minMax: z.array(z.number()), buckets: z.number(), durationSec: z.number() });
export type PeaksDto = z.infer<typeof PeaksSchema>;

// ── Candidate tempos and the chosen tempo ─────────────────────────────────────────────────────────────

export const CandidateInputSchema = z.object({
  bpm: BpmSchema,
  rating: z.number().int().min(1, 'rating is 1 to 5').max(5, 'rating is 1 to 5').nullish(),
  note: z.string().trim().max(500).nullish(),
});
export type CandidateInput = z.infer<typeof CandidateInputSchema>;
export const CandidatePatchSchema = CandidateInputSchema.partial();
export type CandidatePatch = z.infer<typeof CandidatePatchSchema>;
export const CandidateSchema = z.object({
  id: z.string(),
  songId: z.string(),
  bpm: z.number(),
  rating: z.number().nullable(),
  note: z.string().nullable(),
  createdAt: z.string(),
});
export type Candidate = z.infer<typeof CandidateSchema>;
export const CandidateListSchema = z.object({ candidates: z.array(CandidateSchema) });

export const ChooseTempoSchema = z.object({ bpm: BpmSchema, note: z.string().trim().max(2000).nullish() });

// ── Passages ────────────────────────────────────────────────────────────────────────────────────────

const SecondsSchema = z
  .number()
  .min(0, 'times start at 0 s')
  .max(24 * 3600);
const BarSchema = z.number().int().min(1, 'bars are numbered from 1').max(100_000);

/** A named region of one of the song's recordings; bars as numbered on that recording's beat grid. */
export const PassageInputSchema = z
  .object({
    recordingId: z.string().min(1, 'recordingId is required'),
    name: z.string().trim().min(1, 'give the passage a name').max(120, 'use at most 120 characters'),
    startSec: SecondsSchema,
    endSec: SecondsSchema,
    startBar: BarSchema.nullish(),
    endBar: BarSchema.nullish(),
    workingBpm: BpmSchema.nullish(),
    goalBpm: BpmSchema.nullish(),
  })
  .strict()
  .refine((p) => p.endSec > p.startSec, { message: 'the passage must end after it starts', path: ['endSec'] });
export type PassageInput = z.infer<typeof PassageInputSchema>;
export const PassagePatchSchema = z
  .object({
    name: z.string().trim().min(1, 'give the passage a name').max(120, 'use at most 120 characters'),
    startSec: SecondsSchema,
    endSec: SecondsSchema,
    startBar: BarSchema.nullable(),
    endBar: BarSchema.nullable(),
    workingBpm: BpmSchema.nullable(),
    goalBpm: BpmSchema.nullable(),
  })
  .partial()
  .strict();
export type PassagePatch = z.infer<typeof PassagePatchSchema>;
export const PassageSchema = z.object({
  id: z.string(),
  ...SetBySchema,
  songId: z.string(),
  recordingId: z.string(),
  name: z.string(),
  startSec: z.number(),
  endSec: z.number(),
  startBar: z.number().nullable(),
  endBar: z.number().nullable(),
  workingBpm: z.number().nullable(),
  goalBpm: z.number().nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Passage = z.infer<typeof PassageSchema>;
export const PassageListSchema = z.object({ passages: z.array(PassageSchema) });

// ── The practice log ────────────────────────────────────────────────────────────────────────────────

/**
 * How far back a session may be logged, in days: a year, with room for the same date last year to stay in reach
 * at any time of day, leap years included. Further back is more likely a typing slip than a forgotten session.
 */
export const PRACTICE_BACKDATE_DAYS = 367;
/** A client clock this far ahead of the server's is not a session in the future. */
const CLOCK_SKEW_MS = 5 * 60_000;
const DAY_MS = 86_400_000;
/** A malformed instant is left to the format check, so it is told once, in its own words. */
const instantIs = (ok: (ms: number) => boolean) => (iso: string) => {
  const ms = Date.parse(iso);
  return Number.isNaN(ms) || ok(ms);
};

/** When a session was played: an ISO 8601 instant, not in the future and at most a year back. */
export const PractisedAtSchema = z.iso
  .datetime({ offset: true })
  .refine(
    instantIs((ms) => ms <= Date.now() + CLOCK_SKEW_MS),
    'cannot be in the future',
  )
  .refine(
    instantIs((ms) => ms >= Date.now() - PRACTICE_BACKDATE_DAYS * DAY_MS),
    'must be within the last year',
  );

export const PracticeInputSchema = z
  .object({
    /** What was played, in words; for a saved passage the server takes its name. */
    passage: z.string().trim().max(200).nullish(),
    /** A saved passage this entry was played on; its recording and region are filled in from it. */
    passageId: z.string().min(1).nullish(),
    /** Or a region of a recording that is not saved as a passage (a loop). */
    recordingId: z.string().min(1).nullish(),
    startSec: SecondsSchema.nullish(),
    endSec: SecondsSchema.nullish(),
    startBar: BarSchema.nullish(),
    endBar: BarSchema.nullish(),
    startBpm: BpmSchema,
    reachedBpm: BpmSchema,
    repetitions: z.number().int().min(1, 'must be at least 1').max(10_000),
    minutes: z
      .number()
      .min(0)
      .max(24 * 60, 'must be at most a day (1440 minutes)'),
    /** The reached tempo was played clean (a step-up run: a full set of clean passes at it). */
    clean: z.boolean(),
    /** What the player wants to remember of the session; blank is none. */
    note: z.string().trim().max(1000, 'use at most 1000 characters').nullish(),
    /** A session logged later: when it was played (the form sends noon of the day chosen, in the player's time
     * zone, so it lands on that day wherever it is read). Left out: now. */
    practisedAt: PractisedAtSchema.nullish(),
  })
  .strict();
export type PracticeInput = z.infer<typeof PracticeInputSchema>;
export const PracticeEntrySchema = z.object({
  id: z.string(),
  songId: z.string(),
  passage: z.string().nullable(),
  passageId: z.string().nullable(),
  recordingId: z.string().nullable(),
  startSec: z.number().nullable(),
  endSec: z.number().nullable(),
  startBar: z.number().nullable(),
  endBar: z.number().nullable(),
  startBpm: z.number(),
  reachedBpm: z.number(),
  repetitions: z.number(),
  minutes: z.number(),
  clean: z.boolean(),
  note: z.string().nullable(),
  /** When the session was played: when it was logged, or the day given for one logged later. */
  createdAt: z.string(),
  /** When it was logged. */
  loggedAt: z.string(),
});
export type PracticeEntryDto = z.infer<typeof PracticeEntrySchema>;
export const PracticeEntryListSchema = z.object({ entries: z.array(PracticeEntrySchema) });
/** A player's whole log across their songs (the weekly summary reads it), each entry with its song's title. */
export const PracticeLogEntrySchema = PracticeEntrySchema.extend({ songTitle: z.string() });
export type PracticeLogEntry = z.infer<typeof PracticeLogEntrySchema>;
export const PracticeLogSchema = z.object({ entries: z.array(PracticeLogEntrySchema) });

// ── Notes on a recording ────────────────────────────────────────────────────────────────────────────

const NoteTextSchema = z.string().trim().min(1, 'write something first').max(2000, 'use at most 2000 characters');
/** A note at a moment (atSec) or on a passage (startSec–endSec, with its bars). */
export const NoteInputSchema = z
  .object({
    text: NoteTextSchema,
    atSec: SecondsSchema.nullish(),
    startSec: SecondsSchema.nullish(),
    endSec: SecondsSchema.nullish(),
    startBar: BarSchema.nullish(),
    endBar: BarSchema.nullish(),
  })
  .strict()
  .refine((n) => (n.atSec != null) !== (n.startSec != null && n.endSec != null), {
    message: 'a note is either at a moment (atSec) or on a passage (startSec and endSec)',
    path: ['atSec'],
  })
  .refine((n) => n.startSec == null || n.endSec == null || n.endSec > n.startSec, {
    message: 'the passage must end after it starts',
    path: ['endSec'],
  });
export type NoteInput = z.infer<typeof NoteInputSchema>;
export const ReplyInputSchema = z.object({ text: NoteTextSchema }).strict();
export const NotePatchSchema = z.object({ text: NoteTextSchema, resolved: z.boolean() }).partial().strict();
export type NotePatch = z.infer<typeof NotePatchSchema>;
export const NoteAuthorSchema = z.object({ id: z.string(), name: z.string() });
export const NoteReplySchema = z.object({
  id: z.string(),
  author: NoteAuthorSchema,
  text: z.string(),
  /** Written by the person asking: only they edit or delete it. */
  mine: z.boolean(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export const NoteSchema = NoteReplySchema.extend({
  recordingId: z.string(),
  atSec: z.number().nullable(),
  startSec: z.number().nullable(),
  endSec: z.number().nullable(),
  startBar: z.number().nullable(),
  endBar: z.number().nullable(),
  resolved: z.boolean(),
  replies: z.array(NoteReplySchema),
});
export type Note = z.infer<typeof NoteSchema>;
export type NoteReply = z.infer<typeof NoteReplySchema>;
export const NoteListSchema = z.object({ notes: z.array(NoteSchema) });

// ── Intended tempo changes on a recording ─────────────────────────────────────────────────────────────

export const TEMPO_MARK_KINDS = ['rubato', 'ritardando'] as const;
export const TempoMarkKindSchema = z.enum(TEMPO_MARK_KINDS, { message: 'choose rubato or ritardando' });
/** A stretch the player meant to play freely or slowing down: left out of the steadiness figures. */
export const TempoMarkInputSchema = z
  .object({ kind: TempoMarkKindSchema, startSec: SecondsSchema, endSec: SecondsSchema })
  .strict()
  .refine((m) => m.endSec > m.startSec, { message: 'the marked passage must end after it starts', path: ['endSec'] });
export type TempoMarkInput = z.infer<typeof TempoMarkInputSchema>;
export const TempoMarkSchema = z.object({
  id: z.string(),
  recordingId: z.string(),
  kind: TempoMarkKindSchema,
  startSec: z.number(),
  endSec: z.number(),
  createdAt: z.string(),
});
export type TempoMark = z.infer<typeof TempoMarkSchema>;
export const TempoMarkListSchema = z.object({ marks: z.array(TempoMarkSchema) });

/**
 * How the player stretches time (README, "Playback and stretch"): the phase vocoder keeps attacks on time and low
 * notes in tune at every speed; overlap-add keeps drum hits crisper and uses less of the processor.
 */
export const StretchMethodSchema = z.enum(['phase-vocoder', 'overlap-add'], {
  message: 'choose phase-vocoder or overlap-add',
});
export type StretchMethod = z.infer<typeof StretchMethodSchema>;

export const PreferencesSchema = z.object({ noteDigests: z.boolean(), stretchMethod: StretchMethodSchema }).strict();
export type Preferences = z.infer<typeof PreferencesSchema>;

// ── Set lists ───────────────────────────────────────────────────────────────────────────────────────

export const SetListInputSchema = z
  .object({
    name: z.string().trim().min(1, 'give the set list a name').max(120, 'use at most 120 characters'),
    /** The songs in playing order (each once). */
    songIds: z.array(z.string().min(1)).max(200, 'at most 200 songs').default([]),
  })
  .strict();
export type SetListInput = z.infer<typeof SetListInputSchema>;
export const SetListPatchSchema = SetListInputSchema.partial().strict();
export type SetListPatch = z.infer<typeof SetListPatchSchema>;
export const SetListSongSchema = z.object({
  songId: z.string(),
  title: z.string(),
  meter: z.string(),
  /** The click tempo for the stage: the song's chosen tempo (null when none is chosen yet). */
  chosenBpm: z.number().nullable(),
  /** The tempo of its latest analysed recording as the player hears it (their correction and beat level); null
   * without one. Shown, marked as not chosen, where no tempo is chosen. */
  analysedBpm: z.number().nullable(),
  /** How long it lasts, from that recording's measured beats: at the chosen tempo, else (an estimate) at the
   * analysed one; null without measured beats. */
  durationSec: z.number().nullable(),
  /** Which tempo `durationSec` is at; null with no duration. */
  durationAt: z.enum(['chosen', 'analysed']).nullable(),
});
export const SetListSchema = z.object({
  id: z.string(),
  name: z.string(),
  songs: z.array(SetListSongSchema),
  /** The sum of the durations that are known. */
  totalSec: z.number(),
  /** How many songs have no duration yet (no analysed recording). */
  unknownDurations: z.number(),
  /** How many of the songs counted in the total are counted at their analysed tempo (no tempo chosen): the total
   * is then an estimate. */
  estimatedDurations: z.number(),
  updatedAt: z.string(),
});
export type SetListDto = z.infer<typeof SetListSchema>;
export const SetListListSchema = z.object({ setLists: z.array(SetListSchema) });
