import { StyleSheet, View } from 'react-native';
import Svg, { Line, Rect, Text as SvgText } from 'react-native-svg';
import { colors, fonts } from '../theme';
import { Small } from '../ui/Text';
import { countTicks, histogramBars, type HistogramFrame, type HistogramSample } from './histogram';

const LEFT = 44; // room for the count scale

/** The most frequent sampled assignments of a variational run, the best-valued ones in amber. */
export function SampleHistogram(props: { samples: readonly HistogramSample[]; sense: 'max' | 'min'; width: number; height?: number; limit?: number }) {
  const height = props.height ?? 160;
  const frame: HistogramFrame = { width: props.width, height, left: LEFT, top: 18 };
  const bars = histogramBars(props.samples, frame, { sense: props.sense, limit: props.limit });
  const ticks = countTicks(bars, frame);
  const total = props.samples.reduce((s, x) => s + x.count, 0);
  return (
    <View style={styles.wrap} testID="sample-histogram">
      <Svg width={props.width} height={height} accessibilityRole="image" accessibilityLabel={`Histogram of ${total} sampled assignments; the most frequent has value ${bars[0]?.value ?? 'none'}`}>
        {/* The count scale: how many shots gave each assignment. */}
        <SvgText x={0} y={10} fontSize={11} fontFamily={fonts.regular} fill={colors.textMuted}>shots</SvgText>
        {ticks.map((t) => (
          <Line key={`g${t.count}`} x1={LEFT} x2={props.width} y1={t.y} y2={t.y} stroke={colors.line} strokeWidth={1} />
        ))}
        {ticks.map((t) => (
          <SvgText key={`t${t.count}`} x={LEFT - 6} y={t.y + 4} fontSize={11} fontFamily={fonts.regular} fill={colors.textMuted} textAnchor="end" testID="histogram-tick">
            {t.count.toLocaleString('en-GB')}
          </SvgText>
        ))}
        {bars.map((b) => (
          <Rect key={b.key} x={b.x} y={b.y} width={b.width} height={b.height} fill={b.best ? colors.signal : colors.inkSoft} rx={2} testID="histogram-bar" />
        ))}
        {bars.map((b) => (
          <SvgText key={`${b.key}-v`} x={b.x + b.width / 2} y={height - 8} fontSize={11} fontFamily={fonts.regular} fill={colors.textMuted} textAnchor="middle">
            {String(Math.round(b.value * 100) / 100)}
          </SvgText>
        ))}
      </Svg>
      <Small>Bars: the most frequent sampled assignments ({total} of the shots stored with the result); height = how many shots gave it (scale on the left), label = its value; amber = the best answer among them (feasible first: an unbalanced sample is never marked best).</Small>
    </View>
  );
}

const styles = StyleSheet.create({ wrap: { gap: 4 } });
