// The library's search box, sort and filter: what the player asks for; the server does the finding. The chips wrap
// onto a second line on a phone rather than run off the edge, so every sort is seen.
import React from 'react';
import { View } from 'react-native';
import { Chip, Field, Row, Small } from '@/components/ui';
import { space } from '@/components/theme';
import type { LibrarySort, LibraryStatus } from '@/shared/schemas';

export const SORT_LABELS: Record<LibrarySort, string> = {
  title: 'Title',
  lastPractised: 'Last practised',
  chosenBpm: 'Chosen tempo',
  progress: 'Progress to goal',
};
/** How each sort runs, said where the player chooses it. */
const SORT_HINTS: Record<LibrarySort, string> = {
  title: 'A to Z',
  lastPractised: 'most recent first',
  chosenBpm: 'slowest first',
  progress: 'closest to the goal first',
};
const STATUS_LABELS: { value: LibraryStatus | null; label: string }[] = [
  { value: null, label: 'All' },
  { value: 'learning', label: 'Learning' },
  { value: 'ready', label: 'Ready to perform' },
];
/** The one definition the server applies (LIBRARY_STATUSES in shared/schemas.ts), in the player's words. */
export const READY_MEANS = 'Ready to perform: the working tempo has reached the goal tempo.';

export function LibraryControls({
  q,
  onQ,
  sort,
  onSort,
  status,
  onStatus,
}: {
  q: string;
  onQ: (q: string) => void;
  sort: LibrarySort;
  onSort: (sort: LibrarySort) => void;
  status: LibraryStatus | null;
  onStatus: (status: LibraryStatus | null) => void;
}) {
  return (
    <View style={{ gap: space.md }}>
      <Field
        label="Search"
        placeholder="Title, composer or artist"
        value={q}
        onChangeText={onQ}
        testID="library-search"
        inputMode="search"
        autoCorrect={false}
      />
      <View style={{ gap: space.xs }}>
        <Small>
          Sort by {SORT_LABELS[sort].toLowerCase()}, {SORT_HINTS[sort]}
        </Small>
        <Row>
          {(Object.keys(SORT_LABELS) as LibrarySort[]).map((key) => (
            <Chip
              key={key}
              label={SORT_LABELS[key]}
              hint={`Sort by ${SORT_LABELS[key].toLowerCase()}, ${SORT_HINTS[key]}`}
              selected={sort === key}
              onPress={() => onSort(key)}
              testID={`sort-${key}`}
            />
          ))}
        </Row>
      </View>
      <View style={{ gap: space.xs }}>
        <Small>Show</Small>
        <Row>
          {STATUS_LABELS.map(({ value, label }) => (
            <Chip
              key={label}
              label={label}
              selected={status === value}
              onPress={() => onStatus(value)}
              testID={`status-${value ?? 'all'}`}
            />
          ))}
        </Row>
        <Small>{READY_MEANS}</Small>
      </View>
    </View>
  );
}
