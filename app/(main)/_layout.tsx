// Signed-in frame: send anonymous visitors to sign-in, then show the navigation for this user's role.
import React from 'react';
import { Redirect, Slot, usePathname, useRouter } from 'expo-router';
import { NavShell, type NavItem } from '@/components/NavShell';
import { Loading, Notice, Screen } from '@/components/ui';
import { useMe } from '@/client/hooks';

export default function MainLayout() {
  const { me, signedOut, error, isLoading } = useMe();
  const router = useRouter();
  const pathname = usePathname();

  if (signedOut) return <Redirect href="/sign-in" />;
  if (error) {
    return (
      <Screen>
        <Notice tone="error">Tactus cannot reach its server right now ({error.message}). Try again in a moment.</Notice>
      </Screen>
    );
  }
  if (isLoading || !me) return <Loading />;

  const items: NavItem[] = [
    { href: '/', label: 'Library', glyph: '♪' },
    { href: '/practice', label: 'Practice', glyph: '◴' },
    { href: '/set-lists', label: 'Set lists', glyph: '≣' },
    ...(me.role === 'teacher' || me.role === 'admin'
      ? [{ href: '/students', label: 'Students', glyph: '☰' } as const]
      : []),
    { href: '/account', label: 'Account', glyph: '○' },
  ];

  return (
    <NavShell items={items} current={pathname} onNavigate={(href) => router.navigate(href)} userName={me.name}>
      <Slot />
    </NavShell>
  );
}
