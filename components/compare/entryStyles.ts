import { colors } from '../../constants/theme';

/** How each compared entry is drawn: a colour and a dash pattern, so lines differ without colour too. */
export const ENTRY_STYLES = [
  { color: colors.ink, dash: undefined, name: 'solid' },
  { color: colors.ember, dash: '7 4', name: 'dashed' },
  { color: colors.moss, dash: '2 3', name: 'dotted' },
  { color: '#2F5F8A', dash: '9 3 2 3', name: 'dash-dot' },
] as const;
