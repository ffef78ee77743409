import type { ReactNode } from 'react';
import { ScrollView, StyleSheet, Text, View } from 'react-native';
import { CONTENT_MAX_WIDTH } from '../../constants/breakpoints';
import { colors, space, type } from '../../constants/theme';

/** A section's page: its title, an optional line under it, and scrolling content of readable width. */
export function Screen({ title, lede, children, actions }: { title: string; lede?: string; children?: ReactNode; actions?: ReactNode }) {
  return (
    <ScrollView style={styles.scroll} contentContainerStyle={styles.content}>
      <View style={styles.inner}>
        <View style={styles.head}>
          <View style={styles.titles}>
            <Text role="heading" aria-level={1} style={styles.title}>
              {title}
            </Text>
            {lede ? <Text style={styles.lede}>{lede}</Text> : null}
          </View>
          {actions}
        </View>
        {children}
      </View>
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  scroll: { flex: 1, backgroundColor: colors.paper },
  content: { padding: space.lg, paddingBottom: space.xxxl },
  inner: { width: '100%', maxWidth: CONTENT_MAX_WIDTH, alignSelf: 'center', gap: space.lg },
  head: { flexDirection: 'row', alignItems: 'flex-start', justifyContent: 'space-between', gap: space.md, flexWrap: 'wrap' },
  titles: { gap: space.xs, flexShrink: 1 },
  title: { ...type.title, color: colors.ink },
  lede: { ...type.body, color: colors.graphite, maxWidth: 640 },
});
