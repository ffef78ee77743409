import { useRouter } from 'expo-router';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import { sections, type Section } from '../../constants/sections';
import { colors, fonts, radius, space, touchTarget } from '../../constants/theme';
import { SectionIcon } from '../ui/SectionIcon';
import { TreadleMark } from '../ui/TreadleMark';

/** Wide-screen navigation: the same sections in a dark rail on the left. */
export function SideRail({ active }: { active: Section }) {
  const router = useRouter();
  // A plain pressable link: expo-router's <Link asChild> handed react-native-web a style array it could not apply.
  return (
    <View role="navigation" aria-label="Sections" style={styles.rail}>
      <View style={styles.mark}>
        <TreadleMark size={26} inverse />
      </View>
      {sections.map((s) => {
        const on = s.name === active.name;
        return (
          <Pressable
            key={s.name}
            role="link"
            accessibilityLabel={s.label}
            aria-current={on ? 'page' : undefined}
            onPress={() => router.push(s.href)}
            style={[styles.item, on && styles.itemOn]}
          >
            <SectionIcon name={s.name} color={on ? colors.ember : colors.onInk} size={20} />
            <Text style={[styles.label, on && styles.labelOn]}>{s.label}</Text>
          </Pressable>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  rail: { width: 216, backgroundColor: colors.ink, paddingVertical: space.lg, paddingHorizontal: space.md, gap: space.xs },
  mark: { paddingHorizontal: space.sm, paddingBottom: space.xl },
  item: {
    minHeight: touchTarget,
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.md,
    paddingHorizontal: space.md,
    borderRadius: radius.md,
  },
  itemOn: { backgroundColor: '#2C353C' },
  label: { fontFamily: fonts.bodyMedium, fontSize: 15, color: colors.onInk },
  labelOn: { color: colors.paper, fontFamily: fonts.bodyStrong },
});
