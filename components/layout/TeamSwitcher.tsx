import { useState } from 'react';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import type { Me } from '../../schemas/auth';
import { roleLabels } from '../../schemas/roles';
import { colors, fonts, radius, space, touchTarget, type } from '../../constants/theme';
import type { Mutation } from '../../hooks/mutation';

/** The studio name in the header; for people in several studios, it opens a list to switch between them. */
export function TeamSwitcher({ me, align, switchTeam }: { me: Me; align: 'start' | 'end'; switchTeam: Mutation<number> }) {
  const [open, setOpen] = useState(false);
  const others = me.teams.filter((t) => t.id !== me.team.id);
  const label = (
    <>
      <Text numberOfLines={1} style={styles.teamName}>
        {me.team.name}
        {others.length ? '  ⌄' : ''}
      </Text>
      <Text numberOfLines={1} style={styles.who}>
        {me.user.name} · {roleLabels[me.role]}
      </Text>
    </>
  );
  const alignment = align === 'end' ? styles.end : styles.start;
  if (!others.length) return <View style={[styles.block, alignment]}>{label}</View>;
  return (
    <View style={[styles.block, alignment]}>
      <Pressable
        accessibilityRole="button"
        accessibilityLabel={`Studio ${me.team.name}; switch studio`}
        aria-expanded={open}
        onPress={() => setOpen((o) => !o)}
        style={[styles.trigger, alignment]}
      >
        {label}
      </Pressable>
      {open && (
        <View style={[styles.menu, align === 'end' ? styles.menuEnd : styles.menuStart]} role="menu">
          <Text style={styles.menuTitle}>Switch to</Text>
          {others.map((t) => (
            <Pressable
              key={t.id}
              role="menuitem"
              style={styles.item}
              onPress={() => switchTeam.mutate(t.id, { onSuccess: () => setOpen(false) })}
            >
              <Text style={styles.itemName}>{t.name}</Text>
              <Text style={styles.who}>{roleLabels[t.role]}</Text>
            </Pressable>
          ))}
        </View>
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  block: { flex: 1, zIndex: 10 },
  start: { alignItems: 'flex-start' },
  end: { alignItems: 'flex-end' },
  trigger: { minHeight: touchTarget, justifyContent: 'center' },
  teamName: { fontFamily: fonts.headingMedium, fontSize: 15, color: colors.ink },
  who: { ...type.small, color: colors.graphite },
  menu: {
    position: 'absolute',
    top: touchTarget + 2,
    minWidth: 220,
    backgroundColor: colors.card,
    borderWidth: 1,
    borderColor: colors.rule,
    borderRadius: radius.md,
    padding: space.sm,
    gap: space.xs,
    shadowColor: colors.ink,
    shadowOpacity: 0.15,
    shadowRadius: 12,
    shadowOffset: { width: 0, height: 4 },
  },
  menuStart: { left: 0 },
  menuEnd: { right: 0 },
  menuTitle: { ...type.small, color: colors.graphite, paddingHorizontal: space.sm },
  item: { minHeight: touchTarget, justifyContent: 'center', paddingHorizontal: space.sm, borderRadius: radius.sm },
  itemName: { fontFamily: fonts.bodyStrong, fontSize: 15, color: colors.ink },
});
