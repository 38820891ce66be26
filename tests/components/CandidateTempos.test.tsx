// The candidate tempos card says what its reader can do: the player adds, rates and chooses; a reader who cannot
// (a teacher on a student's song) is told to hop between the player's candidates and to suggest a tempo in a note.
import React from 'react';
import { render, screen } from '@testing-library/react';
import { CandidateTempos, READER_HINT } from '@/components/audition/CandidateTempos';
import type { Candidate, Song } from '@/shared/schemas';

let mockCandidates: Candidate[] = [];
jest.mock('@/client/hooks', () => ({
  useCandidates: () => ({ candidates: mockCandidates }),
  addCandidate: jest.fn(),
  changeCandidate: jest.fn(),
  chooseTempo: jest.fn(),
  removeCandidate: jest.fn(),
}));

const song = { id: 'song-1', chosenBpm: null, chosenNote: null } as unknown as Song;
const candidate = (bpm: number) => ({ id: `c-${bpm}`, songId: 'song-1', bpm, rating: null, note: null }) as Candidate;
const draw = (canEdit: boolean) =>
  render(<CandidateTempos song={song} bpm={96} canEdit={canEdit} wide={false} onHop={() => undefined} />);

test('the player, with none yet, is offered the add button and told to add the ones worth comparing', () => {
  mockCandidates = [];
  draw(true);
  expect(screen.getByTestId('add-candidate')).toBeTruthy();
  expect(screen.getByText(/add the ones worth comparing/)).toBeTruthy();
  expect(screen.queryByText(READER_HINT.none)).toBeNull();
});

test('a reader who cannot add is not told to add: no button, and where a suggestion goes instead', () => {
  mockCandidates = [];
  draw(false);
  expect(screen.queryByTestId('add-candidate')).toBeNull();
  expect(screen.queryByText(/add the ones worth comparing/)).toBeNull();
  expect(screen.getByText(READER_HINT.none)).toBeTruthy();
});

test("a reader with the player's candidates can hop between them and is told rating and choosing are the player's", () => {
  mockCandidates = [candidate(92), candidate(104)];
  draw(false);
  expect(screen.getByTestId('hop-2')).toBeTruthy();
  expect(screen.getByText(READER_HINT.some)).toBeTruthy();
  expect(screen.queryByText('Choose this tempo')).toBeNull();
});
