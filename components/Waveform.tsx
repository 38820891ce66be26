// A recording's whole waveform from its peaks, with the beat grid over it (thinned so lines and bar numbers never
// crowd), at the width it is given. The player's zoomable view is audition/PlayerWaveform.tsx.
import React, { useMemo, useState } from 'react';
import { View } from 'react-native';
import { WaveCanvas } from './waveform/WaveCanvas';
import { peakPyramid } from './waveform/view';

export function Waveform({
  minMax,
  durationSec,
  beats = [],
  downbeats = [],
  height = 96,
  testID,
}: {
  minMax: number[];
  durationSec: number;
  beats?: number[];
  downbeats?: number[];
  height?: number;
  testID?: string;
}) {
  const levels = useMemo(() => peakPyramid(minMax, durationSec), [minMax, durationSec]);
  const [width, setWidth] = useState(0);
  return (
    <View
      testID={testID}
      style={{ width: '100%' }}
      onLayout={(e) => setWidth(Math.max(1, Math.floor(e.nativeEvent.layout.width)))}
    >
      {width > 0 ? (
        <WaveCanvas
          levels={levels}
          from={0}
          to={durationSec}
          width={width}
          height={height}
          beats={beats}
          downbeats={downbeats}
        />
      ) : null}
    </View>
  );
}
