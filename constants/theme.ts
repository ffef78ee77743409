/** Treadle's identity: colours, type and spacing. */
import { colors, fonts } from './palette';

export { colors, fonts };

export const stumbleColors = {
  sink: '#7A4EAB',
  skid: '#D99A1E',
  'reach-miss': '#C8354B',
  scuff: '#2F8FA6',
  snap: '#34495E',
} as const;

/** The files behind each family name, loaded once by the root layout. */
export const fontFiles = {
  SpaceGrotesk_700Bold: require('../fonts/SpaceGrotesk_700Bold.ttf'),
  SpaceGrotesk_500Medium: require('../fonts/SpaceGrotesk_500Medium.ttf'),
  Inter_400Regular: require('../fonts/Inter_400Regular.ttf'),
  Inter_500Medium: require('../fonts/Inter_500Medium.ttf'),
  Inter_600SemiBold: require('../fonts/Inter_600SemiBold.ttf'),
  IBMPlexMono_400Regular: require('../fonts/IBMPlexMono_400Regular.ttf'),
  IBMPlexMono_500Medium: require('../fonts/IBMPlexMono_500Medium.ttf'),
};

/** A 1.25 type scale from a 16 px body. */
export const type = {
  display: { fontFamily: fonts.heading, fontSize: 31, lineHeight: 36 },
  title: { fontFamily: fonts.heading, fontSize: 25, lineHeight: 30 },
  heading: { fontFamily: fonts.headingMedium, fontSize: 20, lineHeight: 26 },
  body: { fontFamily: fonts.body, fontSize: 16, lineHeight: 23 },
  label: { fontFamily: fonts.bodyMedium, fontSize: 14, lineHeight: 19 },
  small: { fontFamily: fonts.body, fontSize: 13, lineHeight: 18 },
  figure: { fontFamily: fonts.mono, fontSize: 15, lineHeight: 20 },
} as const;

export const space = { xs: 4, sm: 8, md: 12, lg: 16, xl: 24, xxl: 32, xxxl: 48 } as const;
export const radius = { sm: 6, md: 10, lg: 16 } as const;
/** The smallest touch target we allow (WCAG 2.5.5 target size, 44 × 44 CSS px). */
export const touchTarget = 44;
