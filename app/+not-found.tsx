import { Link } from 'expo-router';
import { StyleSheet, Text, View } from 'react-native';
import { colors, fonts, space, type } from '../constants/theme';

export default function NotFoundScreen() {
  return (
    <View style={styles.page}>
      <Text style={styles.title}>No ground here</Text>
      <Text style={styles.body}>This address does not lead to a Treadle page.</Text>
      <Link href="/" style={styles.link}>
        Back to Home
      </Link>
    </View>
  );
}

const styles = StyleSheet.create({
  page: { flex: 1, alignItems: 'center', justifyContent: 'center', gap: space.md, padding: space.xl, backgroundColor: colors.paper },
  title: { ...type.title, color: colors.ink },
  body: { ...type.body, color: colors.graphite },
  link: { color: colors.ember, fontFamily: fonts.bodyStrong, fontSize: 16, padding: space.md },
});
