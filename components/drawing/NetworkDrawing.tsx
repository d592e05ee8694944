import { memo, useMemo } from 'react';
import Svg, { Circle, G, Line, Rect, Text as SvgText } from 'react-native-svg';
import type { Depot, Lane } from '../../shared/engine/network/types';
import { colors, fonts } from '../theme';
import type { Positions } from './layout';
import type { ViewTransform } from './viewport';
import { laneEnds, type Selection } from './draft';
import { placeLabels, type Box, type PlacedLabel } from './labels';
import { labelMeasurer } from './measureLabel';

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
  /** Depot names (default: shown up to 80 depots); placed without collisions either way. */
  showLabels?: boolean;
  /** Screen areas covered by controls: names keep clear of them. */
  reserved?: readonly Box[];
  /** A depot whose full name shows even when names are hidden (the one under the pointer). */
  hovered?: number;
  accessibilityLabel?: string;
  testID?: string;
}

const DepotMark = memo(function DepotMark(p: { x: number; y: number; r: number; fill: string; stroke: string; sw: number; selected: boolean }) {
  return (
    <G>
      {p.selected ? <Circle cx={p.x} cy={p.y} r={p.r * 1.7} fill={colors.signal} opacity={0.35} /> : null}
      <Circle cx={p.x} cy={p.y} r={p.r} fill={p.fill} stroke={p.stroke} strokeWidth={p.sw} />
    </G>
  );
});

/** Mark radius in screen px: 8 up to 80 depots, smaller as the network gets denser (never below 3). */
export const markRadius = (depots: number) => (depots <= 80 ? 8 : Math.max(3, 8 * Math.sqrt(80 / depots)));
const LABEL_PX = 11;

/** Names in screen space (not scaled with the zoom), placed by labels.ts. */
const LabelLayer = memo(function LabelLayer(p: { labels: readonly PlacedLabel[] }) {
  return (
    <G>
      {/* A light plate under each name keeps it readable where lanes run behind it. */}
      {p.labels.map((l) => (
        <Rect key={`plate-${l.index}`} x={l.box.x} y={l.box.y + 1} width={l.box.w} height={l.box.h - 2} rx={3} fill={colors.surface} opacity={0.85} />
      ))}
      {p.labels.map((l) => (
        <SvgText key={l.index} x={l.x} y={l.y} fontSize={LABEL_PX} fontFamily={fonts.medium} fill={colors.text} textAnchor={l.anchor} testID="depot-label">
          {l.text}
        </SvgText>
      ))}
    </G>
  );
});

const LaneMark = memo(function LaneMark(p: { x1: number; y1: number; x2: number; y2: number; stroke: string; sw: number; dash?: string; opacity?: number }) {
  return <Line x1={p.x1} y1={p.y1} x2={p.x2} y2={p.y2} stroke={p.stroke} strokeWidth={p.sw} strokeLinecap="round" strokeDasharray={p.dash} opacity={p.opacity} />;
});

const LaneLayer = memo(function LaneLayer(p: { lanes: readonly Lane[]; ends: Int32Array; xy: Positions; s: number; emphasised?: ReadonlySet<number>; selected?: ReadonlySet<number>; dense: boolean }) {
  let maxW = 0;
  for (const l of p.lanes) maxW = Math.max(maxW, Math.abs(l.weight));
  const out = [];
  for (let e = 0; e < p.lanes.length; e++) {
    const a = p.ends[2 * e], b = p.ends[2 * e + 1];
    if (a < 0 || b < 0) continue;
    const rel = maxW > 0 ? Math.abs(p.lanes[e].weight) / maxW : 0;
    const selected = p.selected?.has(e) ?? false;
    const emph = p.emphasised?.has(e) ?? false;
    // A large network's overview: lanes inside a region recede, crossing lanes stay strong.
    const faint = p.dense && !emph && !selected;
    out.push(
      <LaneMark
        key={e}
        x1={p.xy[2 * a]} y1={p.xy[2 * a + 1]} x2={p.xy[2 * b]} y2={p.xy[2 * b + 1]}
        stroke={selected ? colors.focus : emph ? colors.signalDeep : p.lanes[e].weight < 0 ? colors.danger : colors.inkSoft}
        // Dense overviews keep crossing lanes moderate too, so they read as lines, not one blot.
        sw={(faint ? 0.6 + 1.4 * rel : p.dense ? 1.2 + 1.8 * rel + (selected ? 1 : 0) : 1.5 + 4.5 * rel + (selected || emph ? 2 : 0)) * p.s}
        opacity={faint && p.emphasised ? 0.3 : 1}
        dash={p.lanes[e].weight < 0 ? `${4 * p.s} ${3 * p.s}` : undefined}
      />,
    );
  }
  return <G opacity={0.9}>{out}</G>;
});

const DepotLayer = memo(function DepotLayer(p: { depots: readonly Depot[]; xy: Positions; s: number; r: number; colors?: readonly (string | undefined)[]; selected?: ReadonlySet<number> }) {
  const out = [];
  for (let i = 0; i < p.depots.length; i++) {
    const d = p.depots[i];
    out.push(
      <DepotMark
        key={d.id}
        x={p.xy[2 * i]} y={p.xy[2 * i + 1]}
        r={p.r * p.s} sw={Math.min(2, p.r / 4) * p.s}
        fill={p.colors?.[i] ?? colors.surface}
        stroke={colors.ink}
        selected={p.selected?.has(i) ?? false}
      />,
    );
  }
  return <G>{out}</G>;
});

export function NetworkDrawing(props: NetworkDrawingProps) {
  const ends = useMemo(() => props.ends ?? laneEnds({ depots: props.depots as Depot[], lanes: props.lanes as Lane[] }), [props.ends, props.depots, props.lanes]);
  const s = props.markScale ?? 1;
  const showLabels = props.showLabels ?? props.depots.length <= 80;
  const t = props.transform;
  const pending = props.pendingLane;
  const r = markRadius(props.depots.length);
  const dense = props.depots.length > 80;
  // Busiest depots (most lane volume) get their names first.
  const order = useMemo(() => {
    const volume = new Float64Array(props.depots.length);
    for (let e = 0; e < props.lanes.length; e++) {
      const a = ends[2 * e], b = ends[2 * e + 1];
      if (a < 0 || b < 0) continue;
      volume[a] += Math.abs(props.lanes[e].weight);
      volume[b] += Math.abs(props.lanes[e].weight);
    }
    return Array.from(volume.keys()).sort((a, b) => volume[b] - volume[a] || a - b);
  }, [props.depots.length, props.lanes, ends]);
  const selected = props.selection?.depots;
  const measure = useMemo(() => labelMeasurer(LABEL_PX, fonts.medium), []);
  const labels = useMemo(() => {
    const chosen = new Set<number>(selected ?? []);
    if (props.hovered !== undefined && props.hovered >= 0) chosen.add(props.hovered);
    if (!showLabels && chosen.size === 0) return [];
    const screen = new Float64Array(props.xy.length);
    for (let i = 0; i < props.xy.length; i += 2) {
      screen[i] = t.x + t.k * props.xy[i];
      screen[i + 1] = t.y + t.k * props.xy[i + 1];
    }
    const names = props.depots.map((d) => d.name ?? d.id);
    return placeLabels(screen, names, { width: props.width, height: props.height, fontSize: LABEL_PX, radius: r * s * t.k, order: showLabels ? order : [], always: chosen, reserved: props.reserved, measure });
  }, [measure, showLabels, selected, props.hovered, props.xy, props.depots, props.width, props.height, props.reserved, t.x, t.y, t.k, r, s, order]);
  return (
    <Svg width={props.width} height={props.height} accessibilityLabel={props.accessibilityLabel ?? `Drawing of ${props.depots.length} depots and ${props.lanes.length} lanes`} testID={props.testID}>
      <Rect x={0} y={0} width={props.width} height={props.height} fill={colors.surface} />
      <G transform={`translate(${t.x} ${t.y}) scale(${t.k})`}>
        <LaneLayer lanes={props.lanes} ends={ends} xy={props.xy} s={s} emphasised={props.emphasisedLanes} selected={props.selection?.lanes} dense={dense} />
        {pending && pending.from >= 0 && pending.from < props.depots.length ? (
          <Line x1={props.xy[2 * pending.from]} y1={props.xy[2 * pending.from + 1]} x2={pending.x} y2={pending.y} stroke={colors.signalDeep} strokeWidth={3 * s} strokeDasharray={`${6 * s} ${4 * s}`} />
        ) : null}
        <DepotLayer depots={props.depots} xy={props.xy} s={s} r={r} colors={props.depotColors} selected={props.selection?.depots} />
      </G>
      <LabelLayer labels={labels} />
    </Svg>
  );
}
