import React from 'react';
import { Pressable, Text, View } from 'react-native';
import { Body, Card, Heading, Loading, Small } from './ui';
import { colors, layout, radius, space, type } from './theme';
import { changeRole, useUsers } from '@/client/hooks';
import { ROLES, type Role } from '@/shared/schemas';

const roleNames: Record<Role, string> = { player: 'Player', teacher: 'Teacher', admin: 'Admin' };

/** Admin only: every account with a three-way role switch. */
export function RoleEditor({ selfId }: { selfId: string }) {
  const { users, isLoading } = useUsers(true);
  return (
    <Card testID="role-editor">
      <Heading level={2}>People and roles</Heading>
      <Small>Teachers see their linked students’ songs and takes. Admins manage roles.</Small>
      {isLoading ? <Loading /> : null}
      {users?.map((u) => (
        <View
          key={u.id}
          style={{ borderTopWidth: 1, borderTopColor: colors.line, paddingTop: space.sm, gap: space.xs }}
        >
          <Body>
            {u.name} <Small>{u.email}</Small>
          </Body>
          <View style={{ flexDirection: 'row', gap: space.xs }} role="radiogroup" aria-label={`Role of ${u.name}`}>
            {ROLES.map((r) => {
              const active = u.role === r;
              return (
                <Pressable
                  key={r}
                  role="radio"
                  aria-checked={active}
                  disabled={u.id === selfId && r !== 'admin'}
                  onPress={() => changeRole(u.id, r)}
                  style={{
                    minHeight: layout.minTouch - 8,
                    paddingHorizontal: space.md,
                    justifyContent: 'center',
                    borderRadius: radius.sm,
                    borderWidth: 1.5,
                    borderColor: active ? colors.teal : colors.line,
                    backgroundColor: active ? colors.teal : colors.card,
                  }}
                >
                  <Text style={[type.label, { color: active ? colors.white : colors.ink }]}>{roleNames[r]}</Text>
                </Pressable>
              );
            })}
          </View>
        </View>
      ))}
    </Card>
  );
}
