import { Link } from 'expo-router';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import { useSafeAreaInsets } from 'react-native-safe-area-context';
import { sections, type Section } from '../../constants/sections';
import { colors, fonts, space, touchTarget } from '../../constants/theme';
import { SectionIcon } from '../ui/SectionIcon';

/** Phone navigation: the six sections along the bottom edge, within thumb reach. */
export function TabBar({ active }: { active: Section }) {
  const insets = useSafeAreaInsets();
  return (
    <View role="navigation" aria-label="Sections" style={[styles.bar, { paddingBottom: Math.max(insets.bottom, space.xs) }]}>
      {sections.map((s) => {
        const on = s.name === active.name;
        return (
          <Link key={s.name} href={s.href} asChild>
            <Pressable aria-current={on ? 'page' : undefined} accessibilityLabel={s.label} style={styles.tab}>
              <View style={[styles.marker, on && styles.markerOn]} />
              <SectionIcon name={s.name} color={on ? colors.ink : colors.graphite} size={22} />
              <Text numberOfLines={1} style={[styles.label, on && styles.labelOn]}>
                {s.label}
              </Text>
            </Pressable>
          </Link>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  bar: {
    flexDirection: 'row',
    backgroundColor: colors.card,
    borderTopWidth: 1,
    borderTopColor: colors.rule,
  },
  tab: { flex: 1, minHeight: touchTarget + 12, alignItems: 'center', justifyContent: 'center', gap: 2, paddingTop: 2 },
  marker: { position: 'absolute', top: 0, height: 3, width: 28, borderRadius: 2, backgroundColor: 'transparent' },
  markerOn: { backgroundColor: colors.ember },
  label: { fontFamily: fonts.bodyMedium, fontSize: 10.5, color: colors.graphite },
  labelOn: { color: colors.ink },
});
