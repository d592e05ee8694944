import { memo, useMemo } from 'react';
import Svg, { Circle, G, Line, Rect, Text as SvgText } from 'react-native-svg';
import type { Depot, Lane } from '../../shared/engine/network/types';
import { colors, fonts } from '../theme';
import type { Positions } from './layout';
import type { ViewTransform } from './viewport';
import { laneEnds, type Selection } from './draft';

/**
 * The network drawn with react-native-svg: lanes as lines (thicker for more volume), depots as
 * circles. Pure rendering — gestures live in NetworkEditor — so result screens reuse it with
 * per-depot colours (a partition), emphasised lanes (the cut) and a selection.
 *
 * Speed with hundreds of depots: each mark is a memoised component with primitive props, and the
 * two layers are memoised too, so panning or zooming changes one <G transform> and dragging a
 * depot re-renders only that depot and its lanes.
 */
export interface NetworkDrawingProps {
  depots: readonly Depot[];
  lanes: readonly Lane[];
  /** xy[2i], xy[2i+1]: world position of depots[i] (see layout.ts). */
  xy: Positions;
  /** Lane ends as depot indices; computed from ids when left out. */
  ends?: Int32Array;
  width: number;
  height: number;
  transform: ViewTransform;
  /** World units per screen pixel at the zoom the marks are designed for (1 / fitted zoom). */
  markScale?: number;
  /** Fill colour per depot index (e.g. regionColors by part); undefined keeps the default. */
  depotColors?: readonly (string | undefined)[];
  /** Lane indices drawn emphasised (e.g. cut lanes). */
  emphasisedLanes?: ReadonlySet<number>;
  selection?: Selection;
  /** A lane being drawn: from depot index to a world point. */
  pendingLane?: { from: number; x: number; y: number } | null;
  /** Depot labels (default: shown up to 80 depots, where they stay readable). */
  showLabels?: boolean;
  accessibilityLabel?: string;
  testID?: string;
}

const DepotMark = memo(function DepotMark(p: { x: number; y: number; r: number; fill: string; stroke: string; sw: number; label: string | null; fontSize: number; selected: boolean }) {
  return (
    <G>
      {p.selected ? <Circle cx={p.x} cy={p.y} r={p.r * 1.7} fill={colors.signal} opacity={0.35} /> : null}
      <Circle cx={p.x} cy={p.y} r={p.r} fill={p.fill} stroke={p.stroke} strokeWidth={p.sw} />
      {p.label ? (
        <SvgText x={p.x} y={p.y - p.r - p.fontSize * 0.45} fontSize={p.fontSize} fontFamily={fonts.medium} fill={colors.text} textAnchor="middle">
          {p.label}
        </SvgText>
      ) : null}
    </G>
  );
});

const LaneMark = memo(function LaneMark(p: { x1: number; y1: number; x2: number; y2: number; stroke: string; sw: number; dash?: string }) {
  return <Line x1={p.x1} y1={p.y1} x2={p.x2} y2={p.y2} stroke={p.stroke} strokeWidth={p.sw} strokeLinecap="round" strokeDasharray={p.dash} />;
});

const LaneLayer = memo(function LaneLayer(p: { lanes: readonly Lane[]; ends: Int32Array; xy: Positions; s: number; emphasised?: ReadonlySet<number>; selected?: ReadonlySet<number> }) {
  let maxW = 0;
  for (const l of p.lanes) maxW = Math.max(maxW, Math.abs(l.weight));
  const out = [];
  for (let e = 0; e < p.lanes.length; e++) {
    const a = p.ends[2 * e], b = p.ends[2 * e + 1];
    if (a < 0 || b < 0) continue;
    const rel = maxW > 0 ? Math.abs(p.lanes[e].weight) / maxW : 0;
    const selected = p.selected?.has(e) ?? false;
    const emph = p.emphasised?.has(e) ?? false;
    out.push(
      <LaneMark
        key={e}
        x1={p.xy[2 * a]} y1={p.xy[2 * a + 1]} x2={p.xy[2 * b]} y2={p.xy[2 * b + 1]}
        stroke={selected ? colors.focus : emph ? colors.signalDeep : p.lanes[e].weight < 0 ? colors.danger : colors.inkSoft}
        sw={(1.5 + 4.5 * rel + (selected || emph ? 2 : 0)) * p.s}
        dash={p.lanes[e].weight < 0 ? `${4 * p.s} ${3 * p.s}` : undefined}
      />,
    );
  }
  return <G opacity={0.9}>{out}</G>;
});

const DepotLayer = memo(function DepotLayer(p: { depots: readonly Depot[]; xy: Positions; s: number; colors?: readonly (string | undefined)[]; selected?: ReadonlySet<number>; labels: boolean }) {
  const out = [];
  for (let i = 0; i < p.depots.length; i++) {
    const d = p.depots[i];
    out.push(
      <DepotMark
        key={d.id}
        x={p.xy[2 * i]} y={p.xy[2 * i + 1]}
        r={8 * p.s} sw={2 * p.s} fontSize={11 * p.s}
        fill={p.colors?.[i] ?? colors.surface}
        stroke={colors.ink}
        selected={p.selected?.has(i) ?? false}
        label={p.labels ? d.name ?? d.id : null}
      />,
    );
  }
  return <G>{out}</G>;
});

export function NetworkDrawing(props: NetworkDrawingProps) {
  const ends = useMemo(() => props.ends ?? laneEnds({ depots: props.depots as Depot[], lanes: props.lanes as Lane[] }), [props.ends, props.depots, props.lanes]);
  const s = props.markScale ?? 1;
  const labels = props.showLabels ?? props.depots.length <= 80;
  const t = props.transform;
  const pending = props.pendingLane;
  return (
    <Svg width={props.width} height={props.height} accessibilityLabel={props.accessibilityLabel ?? `Drawing of ${props.depots.length} depots and ${props.lanes.length} lanes`} testID={props.testID}>
      <Rect x={0} y={0} width={props.width} height={props.height} fill={colors.surface} />
      <G transform={`translate(${t.x} ${t.y}) scale(${t.k})`}>
        <LaneLayer lanes={props.lanes} ends={ends} xy={props.xy} s={s} emphasised={props.emphasisedLanes} selected={props.selection?.lanes} />
        {pending && pending.from >= 0 && pending.from < props.depots.length ? (
          <Line x1={props.xy[2 * pending.from]} y1={props.xy[2 * pending.from + 1]} x2={pending.x} y2={pending.y} stroke={colors.signalDeep} strokeWidth={3 * s} strokeDasharray={`${6 * s} ${4 * s}`} />
        ) : null}
        <DepotLayer depots={props.depots} xy={props.xy} s={s} colors={props.depotColors} selected={props.selection?.depots} labels={labels} />
      </G>
    </Svg>
  );
}
