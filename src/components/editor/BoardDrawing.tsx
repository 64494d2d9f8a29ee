/**
 * The drawing: a Konva stage showing the board, with navigation (wheel and buttons zoom to a
 * point, drag and Shift+arrow keys pan, fit board, 1:1 on screen), fret picking for the readouts,
 * a keyboard cursor (arrow keys: Left/Right between frets, Up/Down between strings, announced
 * politely) and the measure tool. The view maths live in view-transform.ts.
 */
import type Konva from 'konva';
import { useCallback, useEffect, useLayoutEffect, useMemo, useRef, useState, type KeyboardEvent, type PointerEvent } from 'react';
import { Circle, Group, Layer, Line, Stage } from 'react-konva';
import { formatLength } from '~/lib/format/units.ts';
import type { Layout, Point } from '~/lib/geometry/layout.ts';
import { distance } from '~/lib/geometry/plane.ts';
import { BoardScene } from './BoardScene.tsx';
import { cursorPoint, cursorWords, isCursorKey, stepCursor, type FretCursor } from './fret-cursor.ts';
import { BUTTON } from './control-styles.ts';
import { nearestFret, snapPoint, snapTargets } from './board-picking.ts';
import { DRAWING_COLOURS as C, LINE_WIDTHS_PX as W, PICK_REACH_PX, SNAP_REACH_PX } from './drawing-style.ts';
import { redrawCommitted, redrawDrawn } from './redraw-timing.ts';
import {
  boardToScreen,
  boundsOf,
  clampZoom,
  fitView,
  oneToOneZoom,
  panBy,
  screenToBoard,
  zoomAt,
  zoomBy,
  type ScreenPoint,
  type View,
} from './view-transform.ts';

export interface BoardDrawingProps {
  layout: Layout;
  /** The form is invalid: this is the last valid layout, drawn faded and marked out of date. */
  outOfDate: boolean;
  /** Changing this number fits the board into view (e.g. after loading a preset). */
  fitRequest: number;
  highlightedFret: number | null;
  onHoverFret: (fret: number | null) => void;
  onPickFret: (fret: number | null) => void;
  /** CSS px per real mm on this screen, from the screen calibration. */
  screenPxPerMm: number;
  /** id of the text summary describing the drawing. */
  describedBy: string;
  /** The builder's tools (measure, 1:1 on screen); a client's page leaves them out. */
  builderTools?: boolean;
}

const STAGE_HEIGHT_PX = 400;
/** On a narrow screen (a phone) a long, thin board needs less height: at least this much. */
const MIN_STAGE_HEIGHT_PX = 220;

/** The stage's height for its width: the full height from about 670 px wide, less below. */
function stageHeight(width: number): number {
  return Math.min(STAGE_HEIGHT_PX, Math.max(MIN_STAGE_HEIGHT_PX, Math.round(width * 0.6)));
}
const FIT_MARGIN_PX = 56;
const ZOOM_STEP = 1.25;
const WHEEL_ZOOM_PER_PX = 0.0015;
const PAN_STEP_PX = 40;
/** Pointer travel below which a press counts as a click, not a drag. */
const CLICK_SLOP_PX = 4;

export function BoardDrawing(props: BoardDrawingProps) {
  const { layout, outOfDate, fitRequest, highlightedFret, onHoverFret, onPickFret, screenPxPerMm, describedBy, builderTools = true } = props;
  const containerRef = useRef<HTMLDivElement>(null);
  const layerRef = useRef<Konva.Layer>(null);
  const [size, setSize] = useState({ width: 0, height: STAGE_HEIGHT_PX });
  const [view, setView] = useState<View | null>(null);
  const [measuring, setMeasuring] = useState(false);
  const [measurePoints, setMeasurePoints] = useState<Point[]>([]);
  const [cursor, setCursor] = useState<FretCursor | null>(null);
  const drag = useRef<{ start: ScreenPoint; last: ScreenPoint; moved: boolean } | null>(null);
  const units = layout.units;
  const bounds = useMemo(
    () => boundsOf([...layout.outline, ...layout.strings.flatMap((s) => [s.nut, s.saddle]), layout.saddleLine.start, layout.saddleLine.end]),
    [layout],
  );
  const targets = useMemo(() => snapTargets(layout), [layout]);

  useEffect(() => {
    const element = containerRef.current;
    if (!element) return;
    const observer = new ResizeObserver(([entry]) => {
      if (entry) setSize({ width: Math.floor(entry.contentRect.width), height: stageHeight(Math.floor(entry.contentRect.width)) });
    });
    observer.observe(element);
    return () => observer.disconnect();
  }, []);

  const fit = useCallback(() => {
    if (size.width > 0) setView(fitView(bounds, size.width, size.height, FIT_MARGIN_PX, units));
  }, [bounds, size, units]);

  // Fit when the stage first gets a size, when asked to, and when the units change.
  const lastFit = useRef<{ request: number; units: string; width: number } | null>(null);
  useEffect(() => {
    const previous = lastFit.current;
    if (size.width === 0) return;
    if (previous && previous.request === fitRequest && previous.units === units && previous.width !== 0) return;
    lastFit.current = { request: fitRequest, units, width: size.width };
    fit();
  }, [fitRequest, units, size.width, fit]);

  // Time the board layer's own draw for the redraw bench (no-op unless the bench asked).
  useEffect(() => {
    const layer = layerRef.current;
    if (!layer) return;
    let drawStart = 0;
    layer.on('beforeDraw.bench', () => {
      drawStart = performance.now();
    });
    layer.on('draw.bench', () => redrawDrawn(performance.now() - drawStart));
    return () => {
      layer.off('beforeDraw.bench');
      layer.off('draw.bench');
    };
  }, [view !== null]);
  useLayoutEffect(() => redrawCommitted(), [layout]);

  const centre = { x: size.width / 2, y: size.height / 2 };
  const zoomButtons = (factor: number) => view && setView(zoomBy(view, factor, centre, units));
  const oneToOne = () => view && setView(zoomAt(view, clampZoom(oneToOneZoom(screenPxPerMm, units), units), centre));

  useEffect(() => {
    const element = containerRef.current;
    if (!element) return;
    const onWheel = (event: WheelEvent) => {
      event.preventDefault();
      const anchor = stagePoint(element, event);
      setView((current) => current && zoomBy(current, Math.exp(-event.deltaY * WHEEL_ZOOM_PER_PX), anchor, units));
    };
    element.addEventListener('wheel', onWheel, { passive: false });
    return () => element.removeEventListener('wheel', onWheel);
  }, [units]);

  const pointerAt = (event: PointerEvent<HTMLDivElement>): ScreenPoint => stagePoint(event.currentTarget, event);

  const onPointerDown = (event: PointerEvent<HTMLDivElement>) => {
    const at = pointerAt(event);
    drag.current = { start: at, last: at, moved: false };
    event.currentTarget.setPointerCapture(event.pointerId);
  };

  const onPointerMove = (event: PointerEvent<HTMLDivElement>) => {
    if (!view) return;
    const at = pointerAt(event);
    const current = drag.current;
    if (current) {
      if (distance(current.start, at) > CLICK_SLOP_PX) current.moved = true;
      if (current.moved) {
        setView(panBy(view, at.x - current.last.x, at.y - current.last.y));
        current.last = at;
        return;
      }
    }
    onHoverFret(nearestFret(layout, screenToBoard(view, at), PICK_REACH_PX / view.zoom));
  };

  const onPointerUp = (event: PointerEvent<HTMLDivElement>) => {
    const current = drag.current;
    drag.current = null;
    if (!view || !current || current.moved) return;
    const board = screenToBoard(view, pointerAt(event));
    if (measuring) {
      const { point } = snapPoint(targets, board, SNAP_REACH_PX / view.zoom);
      setMeasurePoints((points) => (points.length >= 2 ? [point] : [...points, point]));
    } else {
      onPickFret(nearestFret(layout, board, PICK_REACH_PX / view.zoom));
    }
  };

  /** Moves the keyboard cursor, shows its fret in the readouts, and pans it into view when it leaves. */
  const moveCursor = (next: FretCursor | null) => {
    if (!view || !next) return;
    setCursor(next);
    onPickFret(next.fret);
    const point = cursorPoint(layout, next);
    if (!point) return;
    const at = boardToScreen(view, point.x, point.y);
    const inside = at.x >= FIT_MARGIN_PX && at.x <= size.width - FIT_MARGIN_PX && at.y >= 0 && at.y <= size.height;
    if (!inside) setView(panBy(view, size.width / 2 - at.x, size.height / 2 - at.y));
  };

  const onKeyDown = (event: KeyboardEvent<HTMLDivElement>) => {
    if (!view) return;
    const pans: Record<string, [number, number]> = {
      ArrowLeft: [PAN_STEP_PX, 0],
      ArrowRight: [-PAN_STEP_PX, 0],
      ArrowUp: [0, PAN_STEP_PX],
      ArrowDown: [0, -PAN_STEP_PX],
    };
    const pan = pans[event.key];
    if (pan && event.shiftKey) setView(panBy(view, pan[0], pan[1]));
    else if (isCursorKey(event.key)) moveCursor(stepCursor(layout, cursor, event.key, highlightedFret));
    else if (event.key === '+' || event.key === '=') zoomButtons(ZOOM_STEP);
    else if (event.key === '-') zoomButtons(1 / ZOOM_STEP);
    else if (event.key === 'Escape') {
      setMeasurePoints([]);
      setCursor(null);
    } else return;
    event.preventDefault();
  };

  // A new layout (another string count, fewer frets) may no longer have the cursor's place.
  const cursorAt = cursor ? cursorPoint(layout, cursor) : null;
  const announced = cursor && cursorAt ? cursorWords(layout, cursor) : '';

  const [first, second] = measurePoints;
  const measured = first && second ? distance(first, second) : null;
  const highlighted = layout.frets.find((fret) => fret.number === highlightedFret);

  return (
    <div className="space-y-2">
      <div role="toolbar" aria-label="Drawing navigation" className="flex flex-wrap items-center gap-2 text-sm">
        <button type="button" className={BUTTON} onClick={() => zoomButtons(ZOOM_STEP)} aria-label="Zoom in">+</button>
        <button type="button" className={BUTTON} onClick={() => zoomButtons(1 / ZOOM_STEP)} aria-label="Zoom out">−</button>
        <button type="button" className={BUTTON} onClick={fit}>Fit board</button>
        {builderTools && (
          <>
            <button type="button" className={BUTTON} onClick={oneToOne}>1:1 on screen</button>
            <button
              type="button"
              className={BUTTON}
              aria-pressed={measuring}
              onClick={() => {
                setMeasuring(!measuring);
                setMeasurePoints([]);
              }}
            >
              {measuring ? 'Measuring: click two points' : 'Measure'}
            </button>
          </>
        )}
        {view && (
          <span className="font-mono text-xs text-ink-soft" aria-live="off">
            {formatScreenScale(view.zoom, screenPxPerMm, units)}
          </span>
        )}
      </div>
      <div
        ref={containerRef}
        role="application"
        aria-roledescription="board drawing"
        aria-label="Drawing of the board (arrow keys: Left and Right move between frets, Up and Down between strings; Shift and arrows or drag to pan; wheel or + and − to zoom)"
        aria-describedby={describedBy}
        tabIndex={0}
        className={`relative touch-none select-none overflow-hidden rounded border border-paper-line bg-white ${measuring ? 'cursor-crosshair' : 'cursor-grab'}`}
        onPointerDown={onPointerDown}
        onPointerMove={onPointerMove}
        onPointerUp={onPointerUp}
        onPointerLeave={() => onHoverFret(null)}
        onKeyDown={onKeyDown}
        data-testid="board-drawing"
      >
        {outOfDate && (
          <p className="absolute left-2 top-2 z-10 rounded border border-caution bg-caution-light px-2 py-1 text-sm" role="status">
            Out of date: this is the last valid layout. Fix the marked fields to redraw.
          </p>
        )}
        {size.width > 0 && view && (
          <Stage width={size.width} height={size.height} listening={false}>
            <Layer ref={layerRef} listening={false} opacity={outOfDate ? 0.45 : 1}>
              <Group name="board-view" x={view.originX} y={view.originY} scaleX={view.zoom} scaleY={-view.zoom}>
                <BoardScene layout={layout} zoom={view.zoom} />
              </Group>
            </Layer>
            <Layer name="overlay" listening={false}>
              <Group x={view.originX} y={view.originY} scaleX={view.zoom} scaleY={-view.zoom}>
                {highlighted && (
                  <Line
                    name="fret-highlight"
                    fret={highlighted.number}
                    points={[highlighted.line.start.x, highlighted.line.start.y, highlighted.line.end.x, highlighted.line.end.y]}
                    stroke={C.highlight}
                    opacity={0.45}
                    strokeWidth={W.highlight}
                    strokeScaleEnabled={false}
                  />
                )}
                {cursorAt && (
                  <Circle name="fret-cursor" fret={cursor?.fret} string={cursor?.string} x={cursorAt.x} y={cursorAt.y} radius={6 / view.zoom} stroke={C.highlight} strokeWidth={W.measure * 1.5} strokeScaleEnabled={false} />
                )}
                {measurePoints.map((point, index) => (
                  <Circle key={index} name="measure-point" x={point.x} y={point.y} radius={4 / view.zoom} stroke={C.measure} strokeWidth={W.measure} strokeScaleEnabled={false} />
                ))}
                {first && second && (
                  <Line name="measure-line" points={[first.x, first.y, second.x, second.y]} stroke={C.measure} strokeWidth={W.measure} dash={[5, 3]} strokeScaleEnabled={false} />
                )}
              </Group>
            </Layer>
          </Stage>
        )}
      </div>
      <p className="min-h-5 font-mono text-sm" role="status" aria-live="polite" aria-atomic="true" aria-label="Keyboard readout">
        {announced}
      </p>
      {measuring && (
        <p className="text-sm" role="status" aria-live="polite">
          {first && second && measured !== null
            ? `Measured distance ${formatLength(measured, units, true)} (along the board ${formatLength(Math.abs(second.x - first.x), units, true)}, across ${formatLength(Math.abs(second.y - first.y), units, true)})`
            : first
              ? 'First point set; click the second point.'
              : 'Click two points on the board; clicks near a fret and string crossing snap to it.'}
        </p>
      )}
    </div>
  );
}

/** A pointer position on the stage, which sits inside the container's border. */
function stagePoint(container: HTMLElement, event: { clientX: number; clientY: number }): ScreenPoint {
  const rect = container.getBoundingClientRect();
  return { x: event.clientX - rect.left - container.clientLeft, y: event.clientY - rect.top - container.clientTop };
}

function formatScreenScale(zoom: number, screenPxPerMm: number, units: Layout['units']): string {
  const realSize = zoom / oneToOneZoom(screenPxPerMm, units);
  return `shown at ${realSize >= 10 ? realSize.toFixed(0) : realSize.toFixed(2)} × real size`;
}
