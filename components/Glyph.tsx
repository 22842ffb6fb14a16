// Falloff's own mark and navigation glyphs, drawn from geometry (no icon set).
import Svg, { Circle, Line, Path, Rect } from 'react-native-svg';

/** The app mark: a point source with its falloff rings, one ring per stop. */
export function Mark({ size = 28, colour = '#f0b24a' }: { size?: number; colour?: string }) {
  return (
    <Svg width={size} height={size} viewBox="0 0 32 32" accessibilityElementsHidden aria-hidden>
      <Circle cx={8} cy={16} r={3.5} fill={colour} />
      <Path d="M14 8 A11 11 0 0 1 14 24" stroke={colour} strokeWidth={2} fill="none" opacity={0.85} />
      <Path d="M20 5 A15 15 0 0 1 20 27" stroke={colour} strokeWidth={2} fill="none" opacity={0.55} />
      <Path d="M26 3 A18 18 0 0 1 26 29" stroke={colour} strokeWidth={2} fill="none" opacity={0.3} />
    </Svg>
  );
}

export type NavGlyphName = 'setups' | 'classes' | 'account';

export function NavGlyph({ name, colour, size = 22 }: { name: NavGlyphName; colour: string; size?: number }) {
  return (
    <Svg width={size} height={size} viewBox="0 0 24 24" accessibilityElementsHidden aria-hidden>
      {name === 'setups' ? (
        <>
          <Rect x={3} y={4} width={18} height={16} rx={2} stroke={colour} strokeWidth={1.8} fill="none" />
          <Circle cx={9} cy={12} r={2.2} fill={colour} />
          <Path d="M11.5 9.5 L17 7 L17 17 L11.5 14.5 Z" fill={colour} opacity={0.5} />
        </>
      ) : name === 'classes' ? (
        <>
          <Rect x={3} y={5} width={18} height={11} rx={1.5} stroke={colour} strokeWidth={1.8} fill="none" />
          <Line x1={12} y1={16} x2={8} y2={21} stroke={colour} strokeWidth={1.8} />
          <Line x1={12} y1={16} x2={16} y2={21} stroke={colour} strokeWidth={1.8} />
          <Line x1={7} y1={9.5} x2={14} y2={9.5} stroke={colour} strokeWidth={1.8} />
          <Line x1={7} y1={12.5} x2={11} y2={12.5} stroke={colour} strokeWidth={1.8} />
        </>
      ) : (
        <>
          <Circle cx={12} cy={8.5} r={4} stroke={colour} strokeWidth={1.8} fill="none" />
          <Path d="M4.5 20.5 C5.5 15.5 18.5 15.5 19.5 20.5" stroke={colour} strokeWidth={1.8} fill="none" />
        </>
      )}
    </Svg>
  );
}
