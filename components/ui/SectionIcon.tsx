import Svg, { Circle, Path, Rect } from 'react-native-svg';
import type { Section } from '../../constants/sections';

/** Our own line icons, drawn on a 24-unit grid. */
export function SectionIcon({ name, color, size = 24 }: { name: Section['name']; color: string; size?: number }) {
  const stroke = { stroke: color, strokeWidth: 2, fill: 'none', strokeLinecap: 'round' as const, strokeLinejoin: 'round' as const };
  return (
    <Svg width={size} height={size} viewBox="0 0 24 24" accessibilityElementsHidden importantForAccessibility="no">
      {name === 'index' && <Path d="M4 20 V10 L12 4 L20 10 V20 H14 V14 H10 V20 Z" {...stroke} />}
      {name === 'characters' && (
        <>
          <Circle cx={8} cy={5} r={2} {...stroke} />
          <Path d="M8 7 L13 13 L9 20 H14" {...stroke} />
        </>
      )}
      {name === 'courses' && <Path d="M2 18 L6 14 L9 16 L13 9 L16 12 L19 10 L22 14 V20 H2 Z" {...stroke} />}
      {name === 'compare' && (
        <>
          <Rect x={4} y={8} width={6} height={12} rx={1} {...stroke} />
          <Rect x={14} y={4} width={6} height={16} rx={1} {...stroke} />
        </>
      )}
      {name === 'profiles' && (
        <>
          <Path d="M6 3 H15 L19 7 V21 H6 Z" {...stroke} />
          <Path d="M10 11 L8.5 13.5 L10 16 M15 11 L16.5 13.5 L15 16" {...stroke} />
        </>
      )}
      {name === 'team' && (
        <>
          <Circle cx={8} cy={9} r={3} {...stroke} />
          <Circle cx={16.5} cy={10} r={2.5} {...stroke} />
          <Path d="M3 20 C3 15 13 15 13 20 M13.5 15.5 C16 14.5 21 15 21 19" {...stroke} />
        </>
      )}
    </Svg>
  );
}
