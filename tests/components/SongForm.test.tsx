// The new-song form validates with the shared schema before anything is sent.
import React from 'react';
import { fireEvent, render, screen, waitFor } from '@testing-library/react';
import { SongForm } from '@/components/SongForm';

test('a missing title is shown beside the field and nothing is submitted', async () => {
  const onSubmit = jest.fn(async () => {});
  render(<SongForm onSubmit={onSubmit} onCancel={() => {}} />);
  fireEvent.click(screen.getByText('Save song'));
  expect(await screen.findByText('give the song a title')).toBeTruthy();
  expect(onSubmit).not.toHaveBeenCalled();
});

test('a goal tempo out of range is refused', async () => {
  const onSubmit = jest.fn(async () => {});
  render(<SongForm onSubmit={onSubmit} onCancel={() => {}} />);
  fireEvent.change(screen.getByLabelText('Title'), { target: { value: 'Harbour Jig' } });
  fireEvent.change(screen.getByLabelText('Goal tempo (BPM)'), { target: { value: '450' } });
  fireEvent.click(screen.getByText('Save song'));
  expect(await screen.findByText('tempo must be at most 300 BPM')).toBeTruthy();
  expect(onSubmit).not.toHaveBeenCalled();
});

test('a valid song is handed over as numbers, with a comma accepted as the decimal mark', async () => {
  const onSubmit = jest.fn(async () => {});
  render(<SongForm onSubmit={onSubmit} onCancel={() => {}} />);
  fireEvent.change(screen.getByLabelText('Title'), { target: { value: 'Harbour Jig' } });
  fireEvent.change(screen.getByLabelText('Key'), { target: { value: ' E minor ' } });
  fireEvent.change(screen.getByLabelText('Meter'), { target: { value: '6/8' } });
  fireEvent.change(screen.getByLabelText('Goal tempo (BPM)'), { target: { value: '116' } });
  fireEvent.change(screen.getByLabelText('Working tempo (BPM)'), { target: { value: '92,5' } });
  fireEvent.click(screen.getByText('Save song'));
  await waitFor(() => expect(onSubmit).toHaveBeenCalledTimes(1));
  expect(onSubmit).toHaveBeenCalledWith({
    title: 'Harbour Jig',
    composer: null,
    key: 'E minor',
    meter: '6/8',
    goalBpm: 116,
    workingBpm: 92.5,
  });
});
