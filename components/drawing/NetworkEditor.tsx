import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { PanResponder, Platform, StyleSheet, View, type GestureResponderEvent, type LayoutChangeEvent } from 'react-native';
import { colors, radius, space } from '../theme';
import { Button } from '../ui/Button';
import { Notice } from '../ui/Notice';
import { Small } from '../ui/Text';
import { NetworkDrawing } from './NetworkDrawing';
import { PromptModal } from './PromptModal';
import { addDepot, addLane, emptySelection, laneEnds, moveDepot, nextDepotId, removeSelected, setLaneWeight, type Draft, type Selection } from './draft';
import type { Projection } from './layout';
import { canvasKeyAction, canvasKeysSentence } from './canvasKeys';
import { depotAt, laneAt } from './hit';
import type { Box } from './labels';
import { parseVolume } from './volume';
import { fitTransform, panBy, pinchTransform, toWorld, zoomAt, type ViewTransform } from './viewport';

const CANVAS_BORDER = 1;

/** Finger-sized hit areas in screen pixels (TOUCH / 2 around a depot). */
const DEPOT_HIT_PX = 22;
const LANE_HIT_PX = 12;
/** Movement below this is a tap, not a drag (px). */
const SLOP_PX = 6;
export type EditorMode = 'lanes' | 'move';

type Gesture =
  | { kind: 'pending'; sx: number; sy: number; depot: number; lane: number; t0: ViewTransform }
  | { kind: 'pan'; t0: ViewTransform }
  | { kind: 'move'; depot: number }
  | { kind: 'connect'; depot: number }
  | { kind: 'pinch'; d0: number; mid0: [number, number]; t0: ViewTransform }
  | { kind: 'none' };

type Prompt = { kind: 'depot'; x: number; y: number } | { kind: 'new-lane'; a: number; b: number } | { kind: 'edit-lane'; lane: number } | null;

/**
 * Drawing and editing on the canvas with one responder (PanResponder works for touch and mouse,
 * also on react-native-web):
 *  - tap empty space → name prompt → new depot there
 *  - drag depot → depot (mode "lanes") → volume prompt → new lane
 *  - drag a depot (mode "move") → move it; drag empty space → pan; two fingers → pinch zoom;
 *    mouse wheel (web) → zoom at the pointer
 *  - tap a depot → select it; tap a lane → select it and edit its volume
 * A transparent layer above the SVG takes every touch, so positions are always relative to the
 * canvas whatever mark is under the finger.
 */
export function NetworkEditor(props: {
  draft: Draft;
  projection: Projection | null;
  onCommit: (next: Draft) => void;
  selection: Selection;
  onSelectionChange: (s: Selection) => void;
  undo?: () => void;
  redo?: () => void;
  canUndo?: boolean;
  canRedo?: boolean;
  readOnly?: boolean;
  height?: number;
  depotColors?: readonly (string | undefined)[];
  emphasisedLanes?: ReadonlySet<number>;
  /** A still picture (printing): no controls, no gestures, names where they fit. */
  still?: boolean;
}) {
  const { draft, projection } = props;
  const [size, setSize] = useState({ width: 0, height: 0 });
  const [transform, setTransform] = useState<ViewTransform>({ k: 1, x: 0, y: 0 });
  const [markScale, setMarkScale] = useState(1);
  const [mode, setMode] = useState<EditorMode>('lanes');
  const [dragAt, setDragAt] = useState<{ depot: number; x: number; y: number } | null>(null);
  const [pending, setPending] = useState<{ from: number; x: number; y: number } | null>(null);
  const [prompt, setPrompt] = useState<Prompt>(null);
  const [message, setMessage] = useState<string | null>(null);
  // The depot under the mouse pointer shows its full name, like a tapped one (web only).
  const [hovered, setHovered] = useState(-1);
  // A keyboard focus ring on the canvas (not on a tap: only when the browser says focus-visible).
  const [keyFocus, setKeyFocus] = useState(false);
  // Names are placed without collisions (labels.ts), so they can show by default up to 80
  // depots; crowded ones are shortened or left out, and a tapped depot always shows its name.
  const [labels, setLabels] = useState(draft.depots.length <= 80);
  const fitted = useRef(false);

  const ends = useMemo(() => laneEnds(draft), [draft]);
  // While a depot is dragged only its position changes; the draft is committed on release.
  const xy = useMemo(() => {
    if (!dragAt) return draft.xy;
    const copy = draft.xy.slice();
    copy[2 * dragAt.depot] = dragAt.x;
    copy[2 * dragAt.depot + 1] = dragAt.y;
    return copy;
  }, [draft.xy, dragAt]);

  // Controls float over the canvas (Undo/Redo top left, zoom bottom right): a fit keeps the
  // depots in the band between them, and names keep clear of their boxes.
  const [controlBoxes, setControlBoxes] = useState<{ history: Box | null; zoom: Box | null }>({ history: null, zoom: null });
  const reserved = useMemo(() => [controlBoxes.history, controlBoxes.zoom].filter((b): b is Box => b !== null), [controlBoxes]);
  const boxOf = (key: 'history' | 'zoom') => (e: LayoutChangeEvent) => {
    const { x, y, width, height } = e.nativeEvent.layout;
    setControlBoxes((c) => (c[key] && c[key]!.x === x && c[key]!.y === y && c[key]!.w === width && c[key]!.h === height ? c : { ...c, [key]: { x, y, w: width, h: height } }));
  };
  const fit = useCallback(() => {
    if (size.width === 0) return;
    const band = (b: Box | null) => (b ? b.y + b.h + space.sm : 0);
    const insets = {
      top: props.readOnly ? 0 : Math.max(band(controlBoxes.history), 56),
      bottom: props.still ? 0 : Math.max(controlBoxes.zoom ? size.height - controlBoxes.zoom.y + space.sm : 0, 56),
      left: 0,
      right: 0,
    };
    const t = fitTransform(draft.xy, size.width, size.height, 32, insets);
    setTransform(t);
    setMarkScale(1 / t.k);
  }, [draft.xy, size, controlBoxes, props.readOnly, props.still]);

  useEffect(() => {
    if (!fitted.current && size.width > 0) {
      fitted.current = true;
      if (draft.depots.length > 0) fit();
      else setTransform({ k: 1, x: size.width / 2, y: size.height / 2 });
    }
  }, [size, fit, draft.depots.length]);

  // The responder is created once; it reads the latest values through this ref.
  const live = useRef({ draft, transform, mode, selection: props.selection, props, xy, ends, markScale });
  live.current = { draft, transform, mode, selection: props.selection, props, xy, ends, markScale };
  const gesture = useRef<Gesture>({ kind: 'none' });
  const overlay = useRef<View>(null);

  const responder = useMemo(() => {
    // On the web the overlay's own box is read at the moment of the event: react-native-web's
    // locationX is measured against whatever element is current when it is read, which is not
    // reliably the canvas. Native platforms report locationX relative to the responder view.
    const local = (e: GestureResponderEvent): [number, number] => {
      const node = overlay.current as unknown as { getBoundingClientRect?: () => { left: number; top: number } } | null;
      if (Platform.OS === 'web' && node?.getBoundingClientRect) {
        const r = node.getBoundingClientRect();
        const w = globalThis as { scrollX?: number; scrollY?: number };
        return [e.nativeEvent.pageX - r.left - (w.scrollX ?? 0), e.nativeEvent.pageY - r.top - (w.scrollY ?? 0)];
      }
      return [e.nativeEvent.locationX, e.nativeEvent.locationY];
    };
    const touchPair = (e: GestureResponderEvent) => {
      const t = e.nativeEvent.touches;
      if (!t || t.length < 2) return null;
      const [a, b] = [t[0], t[1]];
      // Canvas origin in page coordinates: the overlay's box on the web, else from the first touch.
      const node = overlay.current as unknown as { getBoundingClientRect?: () => { left: number; top: number } } | null;
      const r = Platform.OS === 'web' && node?.getBoundingClientRect ? node.getBoundingClientRect() : null;
      const ox = r ? r.left : a.pageX - a.locationX, oy = r ? r.top : a.pageY - a.locationY;
      return { d: Math.hypot(a.pageX - b.pageX, a.pageY - b.pageY), mid: [(a.pageX + b.pageX) / 2 - ox, (a.pageY + b.pageY) / 2 - oy] as [number, number] };
    };
    return PanResponder.create({
      onStartShouldSetPanResponder: () => true,
      onMoveShouldSetPanResponder: () => true,
      onPanResponderTerminationRequest: () => false,
      onPanResponderGrant: (e) => {
        const { transform: t, xy: pos, ends: le, props: p } = live.current;
        const pair = touchPair(e);
        if (pair) {
          gesture.current = { kind: 'pinch', d0: pair.d, mid0: pair.mid, t0: t };
          return;
        }
        const [sx, sy] = local(e);
        const [wx, wy] = toWorld(t, sx, sy);
        const depot = depotAt(pos, wx, wy, DEPOT_HIT_PX / t.k);
        const lane = depot < 0 ? laneAt(pos, le, wx, wy, LANE_HIT_PX / t.k) : -1;
        gesture.current = p.readOnly && depot < 0 && lane < 0 ? { kind: 'pan', t0: t } : { kind: 'pending', sx, sy, depot, lane, t0: t };
      },
      onPanResponderMove: (e, gs) => {
        const g = gesture.current;
        const pair = touchPair(e);
        if (pair) {
          if (g.kind !== 'pinch') {
            setPending(null);
            setDragAt(null);
            gesture.current = { kind: 'pinch', d0: pair.d, mid0: pair.mid, t0: live.current.transform };
            return;
          }
          setTransform(pinchTransform(g.t0, g.mid0, pair.mid, g.d0, pair.d));
          return;
        }
        if (g.kind === 'pending') {
          if (Math.hypot(gs.dx, gs.dy) < SLOP_PX) return;
          const { mode: m, props: p } = live.current;
          if (g.depot >= 0 && !p.readOnly) gesture.current = m === 'move' ? { kind: 'move', depot: g.depot } : { kind: 'connect', depot: g.depot };
          else gesture.current = { kind: 'pan', t0: g.t0 };
        }
        const now = gesture.current;
        const [sx, sy] = local(e);
        const [wx, wy] = toWorld(live.current.transform, sx, sy);
        if (now.kind === 'pan') setTransform(panBy(now.t0, gs.dx, gs.dy));
        else if (now.kind === 'move') setDragAt({ depot: now.depot, x: wx, y: wy });
        else if (now.kind === 'connect') setPending({ from: now.depot, x: wx, y: wy });
      },
      onPanResponderRelease: (e) => {
        // A finger's release is followed by the browser's emulated click at the same spot; by
        // then a dialog opened here covers that spot and would take the click (closing itself or
        // pressing its button). Cancelling the touchend's default stops that click.
        if (Platform.OS === 'web' && (e.nativeEvent as unknown as { type?: string }).type === 'touchend') e.preventDefault();
        const g = gesture.current;
        gesture.current = { kind: 'none' };
        const { draft: d, transform: t, selection: sel, props: p } = live.current;
        const [sx, sy] = local(e);
        const [wx, wy] = toWorld(t, sx, sy);
        if (g.kind === 'pending') {
          if (g.depot >= 0) {
            const depots = new Set(sel.depots);
            if (depots.has(g.depot)) depots.delete(g.depot);
            else depots.add(g.depot);
            p.onSelectionChange({ depots, lanes: new Set() });
          } else if (g.lane >= 0) {
            p.onSelectionChange({ depots: new Set(), lanes: new Set([g.lane]) });
            if (!p.readOnly) setPrompt({ kind: 'edit-lane', lane: g.lane });
          } else if (!p.readOnly) {
            p.onSelectionChange(emptySelection);
            const [tx, ty] = toWorld(t, g.sx, g.sy);
            setPrompt({ kind: 'depot', x: tx, y: ty });
          } else p.onSelectionChange(emptySelection);
        } else if (g.kind === 'move') {
          setDragAt(null);
          p.onCommit(moveDepot(d, g.depot, wx, wy, live.current.props.projection));
        } else if (g.kind === 'connect') {
          setPending(null);
          const target = depotAt(live.current.xy, wx, wy, DEPOT_HIT_PX / t.k);
          if (target >= 0 && target !== g.depot) {
            const tried = addLane(d, g.depot, target, 1);
            if ('problem' in tried) setMessage(tried.problem);
            else setPrompt({ kind: 'new-lane', a: g.depot, b: target });
          } else if (target < 0) setMessage('Release on another depot to add a lane (switch to "Move depots" to move it).');
        }
      },
      onPanResponderTerminate: () => {
        gesture.current = { kind: 'none' };
        setPending(null);
        setDragAt(null);
      },
    });
  }, []);

  const onLayout = (e: LayoutChangeEvent) => {
    // The layout box includes the canvas's border; the drawing (and every name in it) lies inside it.
    const width = e.nativeEvent.layout.width - 2 * CANVAS_BORDER;
    const height = e.nativeEvent.layout.height - 2 * CANVAS_BORDER;
    setSize((s) => (s.width === width && s.height === height ? s : { width, height }));
  };

  const zoomCentre = (factor: number) => setTransform((t) => zoomAt(t, factor, size.width / 2, size.height / 2));
  // Wheel zoom exists only on the web (react-native-web passes onWheel through to the DOM).
  const wheelProps =
    Platform.OS === 'web'
      ? {
          onWheel: (e: { nativeEvent: { deltaY: number; offsetX: number; offsetY: number; cancelable?: boolean; preventDefault?: () => void } }) => {
            const ev = e.nativeEvent;
            if (ev.cancelable) ev.preventDefault?.();
            setTransform((t) => zoomAt(t, Math.exp(-ev.deltaY * 0.0015), ev.offsetX, ev.offsetY));
          },
        }
      : {};

  // Hover (web): the full name of the depot under the pointer, even when names are hidden or shortened.
  const hoverProps =
    Platform.OS === 'web'
      ? {
          onMouseMove: (e: { nativeEvent: { clientX: number; clientY: number } }) => {
            const node = overlay.current as unknown as { getBoundingClientRect?: () => { left: number; top: number } } | null;
            const r = node?.getBoundingClientRect?.();
            if (!r) return;
            const t = live.current.transform;
            const [wx, wy] = toWorld(t, e.nativeEvent.clientX - r.left, e.nativeEvent.clientY - r.top);
            const d = depotAt(live.current.xy, wx, wy, DEPOT_HIT_PX / t.k);
            setHovered((h) => (h === d ? h : d));
          },
          onMouseLeave: () => setHovered(-1),
        }
      : {};
  // Keyboard (web): the canvas is a Tab stop; its keys are in canvasKeys.ts.
  const keyProps =
    Platform.OS === 'web'
      ? {
          tabIndex: 0 as const,
          onFocus: (e: { target?: unknown; nativeEvent?: { target?: unknown } }) => {
            const el = (e.nativeEvent?.target ?? e.target) as { matches?: (q: string) => boolean } | undefined;
            setKeyFocus(el?.matches?.(':focus-visible') ?? true);
          },
          onBlur: () => setKeyFocus(false),
          onKeyDown: (e: { nativeEvent: { key: string }; preventDefault?: () => void }) => {
            const action = canvasKeyAction(e.nativeEvent.key, !!props.readOnly);
            if (!action) return;
            if (action.kind === 'pan') setTransform((t) => panBy(t, action.dx, action.dy));
            else if (action.kind === 'zoom') zoomCentre(action.factor);
            else {
              const [wx, wy] = toWorld(live.current.transform, size.width / 2, size.height / 2);
              props.onSelectionChange(emptySelection);
              setPrompt({ kind: 'depot', x: wx, y: wy });
            }
            e.preventDefault?.();
          },
        }
      : {};

  const selectedCount = props.selection.depots.size + props.selection.lanes.size;
  const laneTitle = prompt?.kind === 'edit-lane' && draft.lanes[prompt.lane] ? `Lane ${draft.lanes[prompt.lane].from}–${draft.lanes[prompt.lane].to}` : prompt?.kind === 'new-lane' ? `New lane ${draft.depots[prompt.a]?.id}–${draft.depots[prompt.b]?.id}` : '';

  return (
    <View style={styles.wrap}>
      {!props.readOnly ? (
        <View style={styles.toolbar} accessibilityRole="toolbar" accessibilityLabel="Drawing tools">
          <View style={styles.segment}>
            <Button label="Draw lanes" tone={mode === 'lanes' ? 'primary' : 'secondary'} onPress={() => setMode('lanes')} accessibilityHint="Drag from one depot to another to add a lane" testID="mode-lanes" style={styles.compact} />
            <Button label="Move depots" tone={mode === 'move' ? 'primary' : 'secondary'} onPress={() => setMode('move')} accessibilityHint="Drag a depot to move it" testID="mode-move" style={styles.compact} />
          </View>
        </View>
      ) : null}
      <View style={[styles.canvas, { height: props.height ?? 420 }]} onLayout={onLayout}>
        {size.width > 0 ? (
          <NetworkDrawing
            depots={draft.depots}
            lanes={draft.lanes}
            xy={xy}
            ends={ends}
            width={size.width}
            height={size.height}
            transform={transform}
            markScale={markScale}
            selection={props.selection}
            pendingLane={pending}
            depotColors={props.depotColors}
            emphasisedLanes={props.emphasisedLanes}
            showLabels={labels}
            reserved={reserved}
            hovered={hovered}
          />
        ) : null}
        <View
          ref={overlay}
          style={[StyleSheet.absoluteFill, keyFocus && styles.keyFocus]}
          {...(props.still ? {} : responder.panHandlers)}
          {...(props.still ? {} : wheelProps)}
          {...(props.still ? {} : hoverProps)}
          {...(props.still ? {} : keyProps)}
          role={props.readOnly ? 'img' : 'application'}
          accessibilityLabel={
            props.readOnly
              ? `Network drawing (${canvasKeysSentence(true)})`
              : `Drawing canvas: tap empty space to add a depot, drag between depots to add a lane; ${canvasKeysSentence(false)}`
          }
          testID="drawing-canvas"
        />
        {!props.still ? (
          <View style={styles.zoom} onLayout={boxOf('zoom')}>
            <Button label={labels ? 'Hide names' : 'Names'} tone="secondary" onPress={() => setLabels((v) => !v)} accessibilityHint="Show or hide depot names in the drawing" />
            <Button label="Fit" tone="secondary" onPress={fit} accessibilityHint="Show the whole network" />
            <Button label="+" tone="secondary" onPress={() => zoomCentre(1.25)} accessibilityHint="Zoom in" testID="zoom-in" />
            <Button label="−" tone="secondary" onPress={() => zoomCentre(0.8)} accessibilityHint="Zoom out" testID="zoom-out" />
          </View>
        ) : null}
        {!props.readOnly ? (
          <View style={styles.history} onLayout={boxOf('history')}>
            <Button label="Undo" tone="secondary" onPress={props.undo} disabled={!props.canUndo} style={styles.compact} />
            <Button label="Redo" tone="secondary" onPress={props.redo} disabled={!props.canRedo} style={styles.compact} />
          </View>
        ) : null}
        {selectedCount > 0 && !props.readOnly ? (
          // Over the canvas, where the selection is, and only while there is one (saves a toolbar row on phones).
          <View style={styles.selectionTools}>
            <Button
              label={`Delete (${selectedCount})`}
              tone="danger"
              onPress={() => {
                props.onCommit(removeSelected(draft, props.selection));
                props.onSelectionChange(emptySelection);
              }}
              accessibilityHint="Remove the selected depots (with their lanes) and lanes"
            />
          </View>
        ) : null}
        {draft.depots.length === 0 && !props.readOnly ? (
          <View style={styles.hint} pointerEvents="none">
            <Small style={styles.hintText}>{Platform.OS === 'web' ? 'Tap anywhere to place the first depot, or press Enter with the drawing focused.' : 'Tap anywhere to place the first depot.'}</Small>
          </View>
        ) : null}
      </View>
      {keyFocus ? (
        // Shown while the canvas has keyboard focus, under it (nothing to tap there moves).
        <Small testID="canvas-keys">{canvasKeysSentence(!!props.readOnly)}.</Small>
      ) : null}
      {message ? (
        <Notice tone="caution" testID="drawing-message">
          {message}
        </Notice>
      ) : null}

      <PromptModal
        visible={prompt?.kind === 'depot'}
        title="New depot"
        label="Depot name"
        hint={`Its id will be ${nextDepotId(draft)}.`}
        confirmLabel="Add depot"
        validate={(t) => (t.trim().length > 200 ? 'keep depot names to 200 characters' : null)}
        onCancel={() => setPrompt(null)}
        onConfirm={(name) => {
          if (prompt?.kind !== 'depot') return;
          props.onCommit(addDepot(draft, { id: nextDepotId(draft), name: name.trim() }, prompt.x, prompt.y, projection));
          setPrompt(null);
          setMessage(null);
        }}
        testID="depot-prompt"
      />
      <PromptModal
        visible={prompt?.kind === 'new-lane' || prompt?.kind === 'edit-lane'}
        title={laneTitle}
        label="Volume"
        initial={prompt?.kind === 'edit-lane' ? String(draft.lanes[prompt.lane]?.weight ?? '') : '1'}
        hint="Freight volume on this lane (a number ≥ 0)."
        keyboardType="decimal-pad"
        confirmLabel={prompt?.kind === 'new-lane' ? 'Add lane' : 'Save volume'}
        validate={(t) => {
          const v = parseVolume(t);
          return typeof v === 'string' ? v : null;
        }}
        onCancel={() => setPrompt(null)}
        onConfirm={(text) => {
          const v = parseVolume(text);
          if (typeof v === 'string' || !prompt) return;
          if (prompt.kind === 'new-lane') {
            const next = addLane(draft, prompt.a, prompt.b, v);
            if ('problem' in next) setMessage(next.problem);
            else {
              props.onCommit(next);
              setMessage(null);
            }
          } else if (prompt.kind === 'edit-lane') props.onCommit(setLaneWeight(draft, prompt.lane, v));
          setPrompt(null);
        }}
        testID="lane-prompt"
      />
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.sm },
  toolbar: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, alignItems: 'center' },
  segment: { flexDirection: 'row', gap: 2, padding: 2, borderRadius: radius.md, backgroundColor: colors.surfaceSunk },
  canvas: { borderRadius: radius.lg, borderWidth: CANVAS_BORDER, borderColor: colors.line, overflow: 'hidden', backgroundColor: colors.surface },
  compact: { paddingHorizontal: space.md },
  history: { position: 'absolute', left: space.sm, top: space.sm, flexDirection: 'row', gap: space.xs },
  selectionTools: { position: 'absolute', right: space.sm, top: space.sm },
  zoom: { position: 'absolute', right: space.sm, bottom: space.sm, flexDirection: 'row', gap: space.xs },
  keyFocus: { borderWidth: 3, borderColor: colors.focus, borderRadius: radius.lg },
  hint: { position: 'absolute', left: 0, right: 0, top: 64, alignItems: 'center' },
  hintText: { backgroundColor: colors.paper, paddingHorizontal: space.md, paddingVertical: space.xs, borderRadius: radius.pill },
});
