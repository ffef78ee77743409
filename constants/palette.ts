/**
 * Treadle's colours and font families, free of any asset import so that
 * server-rendered pages (the local test checkout) can use them too. theme.ts re-exports them for the app.
 */
export const colors = {
  paper: '#F5F1E8',
  paperDeep: '#ECE6D8',
  card: '#FBF9F4',
  ink: '#1E252B',
  graphite: '#5A6670',
  rule: '#D8D1C2',
  ember: '#E4572E',
  emberPressed: '#C4461F',
  moss: '#5B8C5A',
  danger: '#B3261E',
  onInk: '#F5F1E8',
} as const;

/** Family names; each is also the base name of its file under fonts/. */
export const fonts = {
  heading: 'SpaceGrotesk_700Bold',
  headingMedium: 'SpaceGrotesk_500Medium',
  body: 'Inter_400Regular',
  bodyMedium: 'Inter_500Medium',
  bodyStrong: 'Inter_600SemiBold',
  mono: 'IBMPlexMono_400Regular',
  monoMedium: 'IBMPlexMono_500Medium',
} as const;
