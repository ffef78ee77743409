import { colors } from '../../constants/theme';
import type { CharacterDetail, LegSide } from '../../schemas/characters';
import { formatLength, type LengthUnit } from '../../engine/rig/skeleton-scale';

export function formatBytes(n: number): string {
  if (n < 1024) return `${n} B`;
  if (n < 1024 * 1024) return `${(n / 1024).toFixed(1)} KB`;
  return `${(n / (1024 * 1024)).toFixed(1)} MB`;
}

export const formatMetres = (m: number) => `${m.toFixed(m < 10 ? 3 : 1)} m`;

/**
 * The unit a character's lengths are shown in: the unit its file looks authored in while that is clearly not metres
 * and no unit fix is stored (so centimetres are never labelled "m"), else metres.
 */
export function displayUnitOf(detail: Pick<CharacterDetail, 'character' | 'report'>): LengthUnit {
  const guess = detail.report.units?.guess;
  return detail.character.unitScale === 1 && guess?.certainty === 'likely' ? guess.unit : 'metres';
}

/** A length in the character's display unit (metres: as formatMetres). */
export const formatCharacterLength = (value: number, unit: LengthUnit) => (unit === 'metres' ? formatMetres(value) : formatLength(value, unit));
export const toDegrees = (rad: number) => (rad * 180) / Math.PI;
export const formatDegrees = (rad: number) => `${Math.round(toDegrees(rad))}°`;

/** Leg colours in the 3D view and beside each leg: left in ember, right in moss, centre in ink. */
export const sideColor: Record<LegSide, string> = { left: colors.ember, right: colors.moss, centre: colors.ink };

export const DOF_LABEL = { ball: 'Ball', hinge: 'Hinge', universal: 'Universal', slider: 'Slider' } as const;
