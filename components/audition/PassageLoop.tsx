// A passage to loop, snapped to bars or beats (drag across the waveform, or take the bar under the playhead), and
// the step-up run over it: start tempo, step, clean repetitions per step and goal.
import React, { useState } from 'react';
import { Text, View } from 'react-native';
import { Button, Chip, Field, Notice, Row, Small } from '@/components/ui';
import { colors, space, type } from '@/components/theme';
import { formatBpm, plural } from '@/shared/format';
import { stepUpTempos, validatePlan, type StepUpPlan, type StepUpState } from '@/audio/practice/step-up';
import type { Passage } from '@/audio/practice/passage';

export type SnapUnit = 'bar' | 'beat';

export function PassageLoop({
  loop,
  loopLabel,
  unit,
  stepUp,
  defaultPlan,
  canLog,
  lastLogged,
  onUnit,
  onThisBar,
  onClear,
  onStartStepUp,
  onNotClean,
  onEndStepUp,
}: {
  loop: Passage | null;
  loopLabel: string | null;
  unit: SnapUnit;
  stepUp: StepUpState | null;
  defaultPlan: StepUpPlan;
  canLog: boolean;
  lastLogged: string | null;
  onUnit: (u: SnapUnit) => void;
  onThisBar: () => void;
  onClear: () => void;
  onStartStepUp: (plan: StepUpPlan) => void;
  onNotClean: () => void;
  onEndStepUp: () => void;
}) {
  const [plan, setPlan] = useState({
    startBpm: String(defaultPlan.startBpm),
    stepBpm: String(defaultPlan.stepBpm),
    repsPerStep: String(defaultPlan.repsPerStep),
    goalBpm: String(defaultPlan.goalBpm),
  });
  const [problem, setProblem] = useState<string | null>(null);
  const num = (s: string) => Number(s.replace(',', '.'));
  const start = () => {
    const p: StepUpPlan = {
      startBpm: num(plan.startBpm),
      stepBpm: num(plan.stepBpm),
      repsPerStep: num(plan.repsPerStep),
      goalBpm: num(plan.goalBpm),
    };
    const why = validatePlan(p);
    setProblem(why);
    if (!why) onStartStepUp(p);
  };
  const field = (key: keyof typeof plan, label: string) => (
    <View style={{ flexBasis: '40%', flexGrow: 1 }}>
      <Field
        label={label}
        value={plan[key]}
        inputMode="decimal"
        onChangeText={(v) => setPlan({ ...plan, [key]: v })}
        testID={`stepup-${key}`}
      />
    </View>
  );

  return (
    <View style={{ gap: space.sm }} testID="passage-loop">
      <Row>
        <Chip label="Loop this bar" onPress={onThisBar} testID="loop-this-bar" />
        <Small>Snap to</Small>
        <Chip label="bars" selected={unit === 'bar'} onPress={() => onUnit('bar')} />
        <Chip label="beats" selected={unit === 'beat'} onPress={() => onUnit('beat')} />
      </Row>
      {loop ? (
        <Row>
          <Text style={[type.label, { color: colors.amber }]} testID="loop-label">
            Looping {loopLabel}
          </Text>
          <Button label="Stop looping" kind="quiet" onPress={onClear} />
        </Row>
      ) : (
        <Small>Drag across the waveform to mark a passage, then loop it as slowly as it stays clean.</Small>
      )}

      {loop && !stepUp ? (
        <View style={{ gap: space.sm }}>
          <Text style={[type.label, { color: colors.ink }]}>
            Step up: raise the tempo after each set of clean repetitions
          </Text>
          <Row align="flex-end">
            {field('startBpm', 'Start (BPM)')}
            {field('stepBpm', 'Step (BPM)')}
            {field('repsPerStep', 'Clean runs per step')}
            {field('goalBpm', 'Goal (BPM)')}
          </Row>
          {problem ? <Notice tone="error">{problem}</Notice> : null}
          <Button label="Start step-up" onPress={start} testID="start-stepup" />
        </View>
      ) : null}

      {stepUp ? (
        <View style={{ gap: space.sm }} testID="stepup-status">
          <Text style={[type.h3, { color: colors.ink }]}>
            {stepUp.done
              ? `Goal reached: ${formatBpm(stepUp.plan.goalBpm)} BPM`
              : `${formatBpm(stepUp.bpm)} BPM · clean ${stepUp.cleanAtTempo} of ${stepUp.plan.repsPerStep}`}
          </Text>
          <Text style={[type.label, { color: colors.muted }]} testID="stepup-ladder">
            {stepUpTempos(stepUp.plan).map((t, i, all) => (
              <Text key={t}>
                <Text style={t === stepUp.bpm && !stepUp.done ? { color: colors.teal, fontWeight: '700' } : undefined}>
                  {formatBpm(t)}
                </Text>
                {i < all.length - 1 ? ' → ' : ''}
              </Text>
            ))}
          </Text>
          <Small>
            {plural(stepUp.repetitions, 'repetition')} so far · goal {formatBpm(stepUp.plan.goalBpm)} BPM. Every pass
            counts as clean unless you press “That one was not clean” while it plays.
          </Small>
          {!stepUp.done ? (
            <Row>
              <Button label="That one was not clean" kind="secondary" onPress={onNotClean} testID="not-clean" />
              <Button label="End the run" kind="quiet" onPress={onEndStepUp} testID="end-stepup" />
            </Row>
          ) : (
            <Button label="Set up another run" kind="secondary" onPress={onEndStepUp} testID="another-stepup" />
          )}
        </View>
      ) : null}
      {lastLogged ? <Notice tone="success">{lastLogged}</Notice> : null}
      {!canLog && stepUp ? (
        <Small>Only the song’s owner can write to its practice log; this run is not saved.</Small>
      ) : null}
    </View>
  );
}
