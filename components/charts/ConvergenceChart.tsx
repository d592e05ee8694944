import { StyleSheet, View } from 'react-native';
import Svg, { G, Line, Path, Text as SvgText } from 'react-native-svg';
import { colors, fonts } from '../theme';
import { Small } from '../ui/Text';
import { convergenceGeometry, shortNumber as tick, type ConvergencePoint } from './convergence';

/** Median standard error over the trace (what the band's half-height typically is). */
function typicalError(trace: readonly ConvergencePoint[]): number {
  const se = trace.map((p) => p.stdError).filter((v): v is number => v !== undefined && Number.isFinite(v)).sort((a, b) => a - b);
  return se.length ? se[Math.floor(se.length / 2)] : 0;
}

/**
 * Energy of the cost operator against iterations, with the ± standard-error band when the
 * energies are shot estimates. Lower is better for every question (energy = −cut for max-cut).
 */
export function ConvergenceChart(props: { trace: readonly ConvergencePoint[]; width: number; height?: number; title?: string; testID?: string; /** Starts the optimizer makes (the solver's restarts setting), when known. */ restarts?: number }) {
  const height = props.height ?? 180;
  const g = convergenceGeometry(props.trace, { width: props.width, height });
  const first = props.trace[0];
  const last = props.trace[props.trace.length - 1];
  const summary = first && last
    ? `${props.title ?? 'Energy'}: from ${tick(first.energy)} to ${tick(last.energy)} over ${props.trace.length} points${g.band ? ', with a standard-error band' : ''}${g.restarts.length ? `, ${g.restarts.length + 1} optimizer starts` : ''}`
    : 'No convergence data yet';
  return (
    <View style={styles.wrap} testID={props.testID ?? 'convergence-chart'}>
      <Svg width={props.width} height={height} accessibilityRole="image" accessibilityLabel={summary}>
        <G>
          {g.yTicks.map((t, i) => (
            <G key={`y${t}`}>
              <Line x1={g.margin.left} x2={props.width - g.margin.right} y1={g.y(t)} y2={g.y(t)} stroke={colors.line} strokeWidth={1} />
              <SvgText x={g.margin.left - 6} y={g.y(t) + 4} fontSize={11} fontFamily={fonts.regular} fill={colors.textMuted} textAnchor="end">
                {g.yTickLabels[i]}
              </SvgText>
            </G>
          ))}
          {g.xTicks.map((t) => (
            <SvgText key={`x${t}`} x={g.x(t)} y={height - 8} fontSize={11} fontFamily={fonts.regular} fill={colors.textMuted} textAnchor="middle">
              {tick(t)}
            </SvgText>
          ))}
        </G>
        {/* Strong enough to read on white (the band was 25 % amber: barely visible), edged in the deeper amber. */}
        {g.band ? <Path d={g.band} fill={colors.signal} fillOpacity={0.5} stroke={colors.signalDeep} strokeOpacity={0.6} strokeWidth={1} testID="convergence-band" /> : null}
        {g.line ? <Path d={g.line} fill="none" stroke={colors.ink} strokeWidth={2} testID="convergence-line" /> : null}
        {g.restarts.map((m) => (
          <G key={`r${m.iteration}`} testID="convergence-restart-marker">
            <Line x1={m.x} x2={m.x} y1={g.margin.top} y2={height - g.margin.bottom} stroke={colors.signalDeep} strokeWidth={1.5} strokeDasharray="4 3" />
            <SvgText x={m.x + 3} y={g.margin.top + 10} fontSize={11} fontFamily={fonts.regular} fill={colors.signalDeep}>
              {`start ${m.start}`}
            </SvgText>
          </G>
        ))}
      </Svg>
      <Small>Energy (lower is better) by iteration{g.band ? `; shaded: ± one standard error from shot noise (typically ± ${tick(typicalError(props.trace))})` : ''}.</Small>
      <Small testID="convergence-restarts">
        {g.restarts.length > 0
          ? `Dashed lines mark where the optimizer started again from different angles (${g.restarts.map((m) => `start ${m.start}`).join(', ')}); the energy may jump upward there, and the best over all ${g.restarts.length + 1} starts is kept.`
          : props.restarts && props.restarts > 1
          ? `The optimizer starts ${props.restarts} times from different angles and keeps the best; each new start shows as a jump upward.`
          : 'A jump upward means the optimizer started again from different angles (a restart); the best over all starts is kept.'}
      </Small>
    </View>
  );
}

const styles = StyleSheet.create({ wrap: { gap: 4 } });
