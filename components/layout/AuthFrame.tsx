import type { ReactNode } from 'react';
import { ScrollView, StyleSheet, Text, View } from 'react-native';
import { colors, space, type } from '../../constants/theme';
import { useIsWide } from '../../hooks/useLayout';
import { TreadleMark } from '../ui/TreadleMark';

/** Sign-in and sign-up pages: the form on paper; on a wide screen an ink panel says what Treadle is for. */
export function AuthFrame({ children }: { children: ReactNode }) {
  const wide = useIsWide();
  return (
    <View style={styles.page}>
      {wide && (
        <View style={styles.panel}>
          <TreadleMark size={40} inverse />
          <Text style={styles.pitch}>Feet that land where the ground is.</Text>
          <Text style={styles.pitchBody}>
            Walk your characters over uneven test ground, count every stumble, let the tuner dial in the leg solver, and hand your
            runtime a versioned leg profile.
          </Text>
        </View>
      )}
      <ScrollView style={styles.formSide} contentContainerStyle={styles.formContent}>
        {!wide && (
          <View style={styles.phoneMark}>
            <TreadleMark size={34} />
          </View>
        )}
        <View style={styles.form}>{children}</View>
      </ScrollView>
    </View>
  );
}

const styles = StyleSheet.create({
  page: { flex: 1, flexDirection: 'row', backgroundColor: colors.paper },
  panel: { flex: 1, backgroundColor: colors.ink, padding: space.xxxl, justifyContent: 'center', gap: space.xl },
  pitch: { ...type.display, color: colors.onInk, maxWidth: 420 },
  pitchBody: { ...type.body, color: '#C9C3B6', maxWidth: 420 },
  formSide: { flex: 1 },
  formContent: { flexGrow: 1, justifyContent: 'center', padding: space.xl },
  phoneMark: { alignItems: 'center', marginBottom: space.xl },
  form: { width: '100%', maxWidth: 400, alignSelf: 'center', gap: space.lg },
});
