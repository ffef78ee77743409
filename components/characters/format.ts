import { colors } from '../../constants/theme';
import type { LegSide } from '../../schemas/characters';

export function formatBytes(n: number): string {
  if (n < 1024) return `${n} B`;
  if (n < 1024 * 1024) return `${(n / 1024).toFixed(1)} KB`;
  return `${(n / (1024 * 1024)).toFixed(1)} MB`;
}

export const formatMetres = (m: number) => `${m.toFixed(m < 10 ? 3 : 1)} m`;
export const toDegrees = (rad: number) => (rad * 180) / Math.PI;
export const formatDegrees = (rad: number) => `${Math.round(toDegrees(rad))}°`;

/** Leg colours in the 3D view and beside each leg: left in ember, right in moss, centre in ink. */
export const sideColor: Record<LegSide, string> = { left: colors.ember, right: colors.moss, centre: colors.ink };

export const DOF_LABEL = { ball: 'Ball', hinge: 'Hinge', universal: 'Universal', slider: 'Slider' } as const;
