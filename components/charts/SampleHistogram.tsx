import { StyleSheet, View } from 'react-native';
import Svg, { Rect, Text as SvgText } from 'react-native-svg';
import { colors, fonts } from '../theme';
import { Small } from '../ui/Text';
import { histogramBars, type HistogramSample } from './histogram';

/** The most frequent sampled assignments of a variational run, the best-valued ones in amber. */
export function SampleHistogram(props: { samples: readonly HistogramSample[]; sense: 'max' | 'min'; width: number; height?: number; limit?: number }) {
  const height = props.height ?? 160;
  const bars = histogramBars(props.samples, { width: props.width, height }, { sense: props.sense, limit: props.limit });
  const total = props.samples.reduce((s, x) => s + x.count, 0);
  return (
    <View style={styles.wrap} testID="sample-histogram">
      <Svg width={props.width} height={height} accessibilityRole="image" accessibilityLabel={`Histogram of ${total} sampled assignments; the most frequent has value ${bars[0]?.value ?? 'none'}`}>
        {bars.map((b) => (
          <Rect key={b.key} x={b.x} y={b.y} width={b.width} height={b.height} fill={b.best ? colors.signal : colors.inkSoft} rx={2} testID="histogram-bar" />
        ))}
        {bars.map((b) => (
          <SvgText key={`${b.key}-v`} x={b.x + b.width / 2} y={height - 8} fontSize={11} fontFamily={fonts.regular} fill={colors.textMuted} textAnchor="middle">
            {String(Math.round(b.value * 100) / 100)}
          </SvgText>
        ))}
      </Svg>
      <Small>Bars: the most frequent sampled assignments ({total} of the shots stored with the result), each labelled with its value; amber = the best value among them.</Small>
    </View>
  );
}

const styles = StyleSheet.create({ wrap: { gap: 4 } });
