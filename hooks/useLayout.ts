import { useWindowDimensions } from 'react-native';
import { WIDE_MIN_WIDTH } from '../constants/breakpoints';

/** Phone layout below the breakpoint, wide layout (side rail) at and above it. */
export function useIsWide(): boolean {
  return useWindowDimensions().width >= WIDE_MIN_WIDTH;
}
