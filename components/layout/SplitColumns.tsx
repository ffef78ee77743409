import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { space } from '../../constants/theme';
import { useIsWide } from '../../hooks/useLayout';

/**
 * A page's two columns: side by side on a wide screen (`weights` share the width, 1:1 unless told), one above the
 * other on a phone, main first. `narrow` replaces the phone order where a page needs another (progress first, a
 * sticky preview). `stickySide` keeps the side column in view while the main one scrolls on a wide screen.
 */
export function SplitColumns({ main, side, weights = [1, 1], stickySide = false, narrow }: { main: ReactNode; side: ReactNode; weights?: readonly [number, number]; stickySide?: boolean; narrow?: ReactNode }) {
  const wide = useIsWide();
  if (!wide) {
    return (
      <View style={styles.stack}>
        {narrow ?? (
          <>
            <View style={styles.col}>{main}</View>
            <View style={styles.col}>{side}</View>
          </>
        )}
      </View>
    );
  }
  return (
    <View style={styles.row}>
      <View style={[styles.col, styles.wideCol, { flex: weights[0] }]}>{main}</View>
      <View style={[styles.col, styles.wideCol, { flex: weights[1] }, stickySide && styles.sticky]}>{side}</View>
    </View>
  );
}

const styles = StyleSheet.create({
  stack: { gap: space.lg },
  row: { flexDirection: 'row', alignItems: 'flex-start', gap: space.lg },
  col: { gap: space.lg },
  wideCol: { minWidth: 0 },
  // position: sticky is a web value react-native-web passes through; the page's scroll view is its container.
  sticky: { position: 'sticky' as 'relative', top: 0 },
});
