// Small presentational building blocks shared by every screen.
import React from 'react';
import {
  ActivityIndicator,
  Platform,
  Pressable,
  ScrollView,
  StyleSheet,
  Text,
  TextInput,
  View,
  type TextInputProps,
  type ViewStyle,
} from 'react-native';
import { colors, layout, radius, space, type } from './theme';

/** A scrolling page with a capped reading width; `wide` pages (the player) may use more of a big screen. */
export function Screen({ children, testID, wide }: { children: React.ReactNode; testID?: string; wide?: boolean }) {
  return (
    <ScrollView style={styles.scroll} contentContainerStyle={styles.scrollContent} testID={testID}>
      <View style={[styles.column, wide && { maxWidth: layout.wideContentMax }]}>{children}</View>
    </ScrollView>
  );
}

export function Heading({ children, level = 1 }: { children: React.ReactNode; level?: 1 | 2 | 3 }) {
  const style = level === 1 ? type.h1 : level === 2 ? type.h2 : type.h3;
  return (
    <Text role="heading" aria-level={level} style={[style, { color: colors.ink }]}>
      {children}
    </Text>
  );
}

export function Body({ children, muted, style }: { children: React.ReactNode; muted?: boolean; style?: object }) {
  return <Text style={[type.body, { color: muted ? colors.muted : colors.ink }, style]}>{children}</Text>;
}

export function Small({ children, muted = true }: { children: React.ReactNode; muted?: boolean }) {
  return <Text style={[type.small, { color: muted ? colors.muted : colors.ink }]}>{children}</Text>;
}

export function Card({ children, style, testID }: { children: React.ReactNode; style?: ViewStyle; testID?: string }) {
  return (
    <View style={[styles.card, style]} testID={testID}>
      {children}
    </View>
  );
}

type ButtonKind = 'primary' | 'secondary' | 'quiet' | 'danger';

export function Button({
  label,
  onPress,
  kind = 'primary',
  busy,
  disabled,
  testID,
}: {
  label: string;
  onPress: () => void;
  kind?: ButtonKind;
  busy?: boolean;
  disabled?: boolean;
  testID?: string;
}) {
  // Quiet buttons are links in running text (back, undo): as wide as their words, at the start of the line.
  const fit = kind === 'quiet' ? ({ alignSelf: 'flex-start', paddingHorizontal: space.sm } as const) : null;
  const palette = buttonColors[kind];
  return (
    <Pressable
      role="button"
      accessibilityLabel={label}
      testID={testID}
      onPress={onPress}
      disabled={disabled || busy}
      style={({ pressed, hovered }: { pressed: boolean; hovered?: boolean }) => [
        styles.button,
        fit,
        { backgroundColor: palette.bg, borderColor: palette.border },
        (pressed || hovered) && { backgroundColor: palette.active },
        (disabled || busy) && { opacity: 0.55 },
      ]}
    >
      {busy ? (
        <ActivityIndicator color={palette.fg} />
      ) : (
        <Text style={[type.label, { color: palette.fg }]}>{label}</Text>
      )}
    </Pressable>
  );
}

const buttonColors: Record<ButtonKind, { bg: string; fg: string; border: string; active: string }> = {
  primary: { bg: colors.teal, fg: colors.white, border: colors.teal, active: colors.tealDark },
  secondary: { bg: colors.card, fg: colors.teal, border: colors.teal, active: colors.tealSoft },
  quiet: { bg: 'transparent', fg: colors.teal, border: 'transparent', active: colors.tealSoft },
  danger: { bg: colors.card, fg: colors.danger, border: colors.danger, active: colors.dangerSoft },
};

/** Under a field: its problem (announced), else its hint. */
function FieldNote({ error, hint }: { error?: string | null; hint?: string }) {
  if (error)
    return (
      <Text role="alert" style={[type.small, { color: colors.danger }]}>
        {error}
      </Text>
    );
  return hint ? <Small>{hint}</Small> : null;
}

export function Field({
  label,
  error,
  hint,
  ...input
}: TextInputProps & { label: string; error?: string | null; hint?: string }) {
  return (
    <View style={{ gap: space.xs }}>
      <Text style={[type.label, { color: colors.ink }]}>{label}</Text>
      <TextInput
        accessibilityLabel={label}
        placeholderTextColor="#9aa0a6"
        style={[styles.input, error ? { borderColor: colors.danger } : null]}
        {...input}
      />
      <FieldNote error={error} hint={hint} />
    </View>
  );
}

/**
 * A calendar day, written year-month-day. On the web it is the browser's own date input, so a phone offers its
 * date picker instead of a keyboard; `min` and `max` (also year-month-day) keep the picker within the days allowed.
 */
export function DayField({
  label,
  value,
  onChangeText,
  min,
  max,
  error,
  hint,
  testID,
}: {
  label: string;
  value: string;
  onChangeText: (day: string) => void;
  min?: string;
  max?: string;
  error?: string | null;
  hint?: string;
  testID?: string;
}) {
  if (Platform.OS !== 'web')
    return (
      <Field
        label={label}
        value={value}
        onChangeText={onChangeText}
        placeholder="year-month-day"
        error={error}
        hint={hint}
        testID={testID}
      />
    );
  return (
    <View style={{ gap: space.xs }}>
      <Text style={[type.label, { color: colors.ink }]}>{label}</Text>
      {React.createElement('input', {
        type: 'date',
        value,
        min,
        max,
        'aria-label': label,
        'aria-invalid': error ? true : undefined,
        'data-testid': testID,
        onChange: (e: React.ChangeEvent<HTMLInputElement>) => onChangeText(e.target.value),
        style: {
          // The text field's look (styles.input) in CSS: React Native's numbers are pixels here too.
          fontFamily: type.body.fontFamily,
          fontSize: type.body.fontSize,
          lineHeight: `${type.body.lineHeight}px`,
          minHeight: layout.minTouch,
          boxSizing: 'border-box',
          alignSelf: 'flex-start',
          border: `1.5px solid ${error ? colors.danger : colors.line}`,
          borderRadius: radius.sm,
          padding: `0 ${space.md}px`,
          backgroundColor: colors.white,
          color: colors.ink,
        },
      })}
      <FieldNote error={error} hint={hint} />
    </View>
  );
}

export function Notice({
  children,
  tone = 'info',
}: {
  children: React.ReactNode;
  tone?: 'info' | 'error' | 'success' | 'caution';
}) {
  const bg = { info: colors.tealSoft, success: colors.tealSoft, error: colors.dangerSoft, caution: colors.amberSoft }[
    tone
  ];
  const fg = tone === 'error' ? colors.danger : colors.ink;
  return (
    <View role={tone === 'error' ? 'alert' : undefined} style={[styles.notice, { backgroundColor: bg }]}>
      <Text style={[type.body, { color: fg }]}>{children}</Text>
    </View>
  );
}

/** A compact button for steps, toggles and picks (large enough to hit on a phone); `selected` shows a toggle on. */
export function Chip({
  label,
  onPress,
  selected,
  disabled,
  testID,
  hint,
  compact,
}: {
  label: string;
  onPress: () => void;
  selected?: boolean;
  disabled?: boolean;
  testID?: string;
  hint?: string;
  compact?: boolean;
}) {
  return (
    <Pressable
      role="button"
      accessibilityLabel={hint ?? label}
      accessibilityState={{ selected: !!selected, disabled: !!disabled }}
      aria-pressed={selected === undefined ? undefined : selected}
      testID={testID}
      onPress={onPress}
      disabled={disabled}
      style={({ pressed, hovered }: { pressed: boolean; hovered?: boolean }) => [
        styles.chip,
        // Narrower than a chip, never flush: a word on a compact chip must not touch its border.
        compact && { minWidth: layout.minTouch, paddingHorizontal: space.sm },
        selected && { backgroundColor: colors.teal, borderColor: colors.teal },
        !selected && (pressed || hovered) && { backgroundColor: colors.tealSoft },
        disabled && { opacity: 0.5 },
      ]}
    >
      <Text style={[type.label, { color: selected ? colors.white : colors.ink }]}>{label}</Text>
    </Pressable>
  );
}

/** Chips in a row that wraps. */
export function Row({
  children,
  gap = space.sm,
  align = 'center',
}: {
  children: React.ReactNode;
  gap?: number;
  align?: 'center' | 'flex-end' | 'baseline' | 'flex-start';
}) {
  return <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap, alignItems: align }}>{children}</View>;
}

/** What a screen shows before there is anything in it: what this place is for and the first thing to do. */
export function EmptyState({
  title,
  children,
  action,
}: {
  title: string;
  children: React.ReactNode;
  action?: React.ReactNode;
}) {
  return (
    <Card style={{ alignItems: 'flex-start', gap: space.md, paddingVertical: space.xl }}>
      <Heading level={3}>{title}</Heading>
      <Body muted>{children}</Body>
      {action}
    </Card>
  );
}

export function Loading() {
  return (
    <View style={{ padding: space.xxl, alignItems: 'center' }}>
      <ActivityIndicator color={colors.teal} />
    </View>
  );
}

const styles = StyleSheet.create({
  scroll: { flex: 1, backgroundColor: colors.paper },
  scrollContent: { padding: space.lg, paddingBottom: space.xxl * 2 },
  column: { width: '100%', maxWidth: layout.contentMax, alignSelf: 'center', gap: space.lg },
  card: {
    backgroundColor: colors.card,
    borderRadius: radius.md,
    borderWidth: 1,
    borderColor: colors.line,
    padding: space.lg,
    gap: space.sm,
  },
  button: {
    minHeight: layout.minTouch,
    paddingHorizontal: space.lg,
    borderRadius: radius.sm,
    borderWidth: 1.5,
    alignItems: 'center',
    justifyContent: 'center',
  },
  input: {
    ...type.body,
    minHeight: layout.minTouch,
    borderWidth: 1.5,
    borderColor: colors.line,
    borderRadius: radius.sm,
    paddingHorizontal: space.md,
    backgroundColor: colors.white,
    color: colors.ink,
  },
  notice: { borderRadius: radius.sm, padding: space.md },
  chip: {
    minHeight: layout.minTouch,
    minWidth: 52,
    paddingHorizontal: space.md,
    borderRadius: radius.sm,
    borderWidth: 1.5,
    borderColor: colors.line,
    backgroundColor: colors.card,
    alignItems: 'center',
    justifyContent: 'center',
  },
});
