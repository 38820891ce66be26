// The signed-in frame: a bottom bar on phones, a rail beside the content on wide screens.
import React from 'react';
import { Pressable, StyleSheet, Text, useWindowDimensions, View } from 'react-native';
import type { Href } from 'expo-router';
import { colors, fonts, layout, space, type } from './theme';

export interface NavItem {
  href: Href;
  label: string;
  glyph: string;
}

export function NavShell({
  items,
  current,
  onNavigate,
  userName,
  children,
}: {
  items: NavItem[];
  current: string;
  onNavigate: (href: Href) => void;
  userName?: string;
  children: React.ReactNode;
}) {
  const { width } = useWindowDimensions();
  const wide = width >= layout.wideFrom;
  const isActive = (href: Href) => (href === '/' ? current === '/' : current.startsWith(String(href)));

  if (wide) {
    return (
      <View style={styles.wideRoot}>
        <View style={styles.rail} role="navigation" aria-label="Main">
          <Wordmark />
          {userName ? <Text style={[type.small, styles.railUser]}>{userName}</Text> : null}
          <View style={{ gap: space.xs, marginTop: space.lg }}>
            {items.map((item) => (
              <Pressable
                key={String(item.href)}
                role="link"
                accessibilityLabel={item.label}
                aria-current={isActive(item.href) ? 'page' : undefined}
                onPress={() => onNavigate(item.href)}
                style={[styles.railItem, isActive(item.href) && styles.railItemActive]}
              >
                <Text style={[styles.glyph, isActive(item.href) && { color: colors.white }]}>{item.glyph}</Text>
                <Text style={[type.label, { color: isActive(item.href) ? colors.white : colors.ink }]}>
                  {item.label}
                </Text>
              </Pressable>
            ))}
          </View>
        </View>
        <View style={{ flex: 1 }}>{children}</View>
      </View>
    );
  }

  return (
    <View style={{ flex: 1, backgroundColor: colors.paper }}>
      <View style={styles.topBar}>
        <Wordmark />
      </View>
      <View style={{ flex: 1 }}>{children}</View>
      <View style={styles.bottomBar} role="navigation" aria-label="Main">
        {items.map((item) => (
          <Pressable
            key={String(item.href)}
            role="link"
            accessibilityLabel={item.label}
            aria-current={isActive(item.href) ? 'page' : undefined}
            onPress={() => onNavigate(item.href)}
            style={styles.tab}
          >
            <Text style={[styles.glyph, isActive(item.href) && { color: colors.teal }]}>{item.glyph}</Text>
            <Text
              style={[
                type.small,
                { color: isActive(item.href) ? colors.teal : colors.muted, fontFamily: fonts.bodyMedium },
              ]}
            >
              {item.label}
            </Text>
          </Pressable>
        ))}
      </View>
    </View>
  );
}

/** The name set in our display face with a small beat mark: four dots, the first one accented. */
export function Wordmark() {
  return (
    <View style={{ flexDirection: 'row', alignItems: 'center', gap: space.sm }}>
      <View style={{ flexDirection: 'row', gap: 3, alignItems: 'flex-end' }}>
        {[14, 8, 8, 8].map((h, i) => (
          <View
            key={i}
            style={{ width: 5, height: h, borderRadius: 2, backgroundColor: i === 0 ? colors.amber : colors.teal }}
          />
        ))}
      </View>
      <Text style={{ fontFamily: fonts.displayBold, fontSize: 22, color: colors.teal, letterSpacing: 0.5 }}>
        Tactus
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  wideRoot: { flex: 1, flexDirection: 'row', backgroundColor: colors.paper },
  rail: {
    width: layout.railWidth,
    paddingVertical: space.xl,
    paddingHorizontal: space.lg,
    borderRightWidth: 1,
    borderRightColor: colors.line,
    backgroundColor: colors.card,
  },
  railUser: { color: colors.muted, marginTop: space.sm },
  railItem: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.md,
    minHeight: layout.minTouch,
    paddingHorizontal: space.md,
    borderRadius: 10,
  },
  railItemActive: { backgroundColor: colors.teal },
  glyph: { fontSize: 18, width: 22, textAlign: 'center', color: colors.muted },
  topBar: {
    paddingHorizontal: space.lg,
    paddingVertical: space.md,
    borderBottomWidth: 1,
    borderBottomColor: colors.line,
    backgroundColor: colors.card,
  },
  bottomBar: {
    flexDirection: 'row',
    borderTopWidth: 1,
    borderTopColor: colors.line,
    backgroundColor: colors.card,
    paddingBottom: space.xs,
  },
  tab: { flex: 1, alignItems: 'center', justifyContent: 'center', minHeight: 58, gap: 2 },
});
