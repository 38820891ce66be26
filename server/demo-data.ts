// The invented teaching studio that `npm start` seeds once: Harbour Lane Studio, its teacher and three players.
import type { Role, SongInput } from '@/shared/schemas';

export const DEMO_PASSWORD = 'harbour-lane-demo';

/** A recording that comes with a demo song: an invented piece from fixtures/demo/ (`npm run corpus -- --demo`). */
export interface DemoRecording {
  file: string;
  kind: 'reference' | 'take';
  label: string;
}

export interface DemoPerson {
  name: string;
  email: string;
  role: Role;
  songs: (SongInput & { recordings?: DemoRecording[] })[];
  /** Set lists of this person's songs, by title, in playing order. */
  setLists?: { name: string; songs: string[] }[];
}

export const demoPeople: DemoPerson[] = [
  {
    name: 'Odile Marsh',
    email: 'admin@harbourlane.example',
    role: 'admin',
    songs: [],
  },
  {
    name: 'Marta Quist',
    email: 'marta@harbourlane.example',
    role: 'teacher',
    songs: [
      {
        title: 'Slate Roof Nocturne',
        composer: 'Marta Quist',
        key: 'A♭ major',
        meter: '3/4',
        goalBpm: 66,
        workingBpm: 60,
      },
    ],
  },
  {
    name: 'Ilya Brandt',
    email: 'ilya@harbourlane.example',
    role: 'player',
    songs: [
      {
        title: 'Copperline Reel',
        composer: 'trad. arr. Harbour Lane',
        key: 'D major',
        meter: '4/4',
        goalBpm: 112,
        workingBpm: 88,
        chosenBpm: 104,
        recordings: [
          { file: 'drums-bass-124.mp3', kind: 'reference', label: 'Band run-through, Pier Street rehearsal room' },
        ],
      },
      {
        title: 'Lanterns over Kessel Bay',
        composer: 'Ilya Brandt',
        key: 'E minor',
        meter: '6/8',
        goalBpm: 72,
        workingBpm: 72,
        chosenBpm: 70,
      },
    ],
    setLists: [{ name: 'Friday at the Pier Street café', songs: ['Lanterns over Kessel Bay', 'Copperline Reel'] }],
  },
  {
    name: 'Sanne Okafor',
    email: 'sanne@harbourlane.example',
    role: 'player',
    songs: [
      {
        title: 'Nine Steps Waltz',
        composer: 'Pieter Vahl',
        key: 'G major',
        meter: '3/4',
        goalBpm: 152,
        workingBpm: 126,
        recordings: [
          { file: 'waltz-150.mp3', kind: 'reference', label: 'Piano and strings, Harbour Lane recital 2025' },
        ],
      },
    ],
  },
  {
    name: 'Tomás Reyes',
    email: 'tomas@harbourlane.example',
    role: 'player',
    songs: [],
  },
];

/** Marta teaches the three players. */
export const demoTeacherEmail = 'marta@harbourlane.example';
export const demoStudentEmails = ['ilya@harbourlane.example', 'sanne@harbourlane.example', 'tomas@harbourlane.example'];
