import Svg, { Circle, Line, Path, Rect } from 'react-native-svg';
import type { GlyphName } from './destinations';

/** Our own small line glyphs for the destinations (24-unit grid). */
export function Glyph({ name, color, size = 22 }: { name: GlyphName; color: string; size?: number }) {
  const stroke = { stroke: color, strokeWidth: 2, fill: 'none', strokeLinecap: 'round' as const, strokeLinejoin: 'round' as const };
  return (
    <Svg width={size} height={size} viewBox="0 0 24 24" aria-hidden>
      {name === 'network' && (
        <>
          <Line x1="6" y1="7" x2="17" y2="6" {...stroke} />
          <Line x1="6" y1="7" x2="9" y2="18" {...stroke} />
          <Line x1="17" y1="6" x2="9" y2="18" {...stroke} />
          <Circle cx="6" cy="7" r="2.6" {...stroke} fill={color} />
          <Circle cx="17" cy="6" r="2.6" {...stroke} fill="white" />
          <Circle cx="9" cy="18" r="2.6" {...stroke} fill="white" />
        </>
      )}
      {name === 'runs' && (
        <>
          <Path d="M4 19 L9 12 L13 15 L20 5" {...stroke} />
          <Line x1="4" y1="21" x2="20" y2="21" {...stroke} />
        </>
      )}
      {name === 'team' && (
        <>
          <Circle cx="9" cy="8" r="3.2" {...stroke} />
          <Path d="M3.5 19c0-3.2 2.5-5.5 5.5-5.5s5.5 2.3 5.5 5.5" {...stroke} />
          <Circle cx="17" cy="9" r="2.4" {...stroke} />
          <Path d="M15.5 14.2c2.8-.4 5 1.6 5 4.8" {...stroke} />
        </>
      )}
      {name === 'billing' && (
        <>
          <Rect x="3" y="6" width="18" height="13" rx="2.5" {...stroke} />
          <Line x1="3" y1="10.5" x2="21" y2="10.5" {...stroke} />
          <Line x1="7" y1="15" x2="11" y2="15" {...stroke} />
        </>
      )}
      {name === 'account' && (
        <>
          <Circle cx="12" cy="9" r="3.6" {...stroke} />
          <Path d="M5 20c.8-3.6 3.6-5.6 7-5.6s6.2 2 7 5.6" {...stroke} />
        </>
      )}
    </Svg>
  );
}
