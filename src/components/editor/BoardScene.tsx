/**
 * The board itself, as Konva nodes in board coordinates (the parent group maps them to the
 * screen), drawn from the board picture (~/lib/picture/board-picture) that every other surface
 * draws too. Lines keep a constant screen width (strokeScaleEnabled off); labels are scaled by
 * 1/zoom so they stay readable at any zoom. Every node is named, and lines keep their board
 * coordinates in `points`, so tests and tools can read the scene graph.
 */
import { memo } from 'react';
import { Circle, Group, Line, Text } from 'react-konva';
import { formatLength } from '~/lib/format/units.ts';
import type { Layout, Point, Segment } from '~/lib/geometry/layout.ts';
import { boardPicture, fretNumbersApart, MONO_ADVANCE_EM, partsOn, type Box } from '~/lib/picture/board-picture.ts';
import { DASHES_PX, DRAWING_COLOURS as C, LABEL_FONT, LINE_WIDTHS_PX as W } from './drawing-style.ts';
import { boundsOf } from './view-transform.ts';

interface BoardSceneProps {
  layout: Layout;
  /** Screen px per board unit; used only to keep labels and ticks at a constant screen size. */
  zoom: number;
}

const SCALE_LABEL_WIDTH_PX = 280;
/** A fret number sits this far below the treble end of its line, on screen (px). */
const FRET_NUMBER_DROP_PX = 6;
/** Clear space kept around each fret number, on screen (px). */
const FRET_NUMBER_MARGIN_PX = 1;

/** A fret number's box width on screen (px): its characters plus a pixel either side. */
function fretNumberWidthPx(text: string): number {
  return Math.ceil(text.length * MONO_ADVANCE_EM * LABEL_FONT.sizePx) + 2;
}

/** A fret number's box on screen (px, y down) relative to the view's origin, margin included. */
function fretNumberBox(at: Point, text: string, zoom: number): Box {
  const half = fretNumberWidthPx(text) / 2 + FRET_NUMBER_MARGIN_PX;
  const x = at.x * zoom;
  const top = -at.y * zoom + FRET_NUMBER_DROP_PX;
  return { minX: x - half, maxX: x + half, minY: top - FRET_NUMBER_MARGIN_PX, maxY: top + LABEL_FONT.sizePx + FRET_NUMBER_MARGIN_PX };
}

const segmentPoints = (segment: Segment) => [segment.start.x, segment.start.y, segment.end.x, segment.end.y];

export const BoardScene = memo(function BoardScene({ layout, zoom }: BoardSceneProps) {
  const bounds = boundsOf(layout.outline);
  const labelScale = { scaleX: 1 / zoom, scaleY: -1 / zoom };
  const tick = 16 / zoom;
  const stopped = layout.frets.some((fret) => fret.slot.start.x !== fret.line.start.x || fret.slot.start.y !== fret.line.start.y);
  const perpendicularX = layout.perpendicularFret.x;
  const showUnits = (length: number) => formatLength(length, layout.units, true);
  const picture = boardPicture(layout);
  const dots = [...partsOn(picture, 'face-dots', 'circle'), ...partsOn(picture, 'side-dots', 'circle')];
  const slots = new Map(partsOn(picture, 'slots', 'line').map((part) => [part.fret, part.segment]));
  const frets = partsOn(picture, 'frets', 'line');
  const fretLines = frets.filter((part) => part.fret !== 0);
  const zeroFret = frets.find((part) => part.fret === 0);
  // The shared rule: at this zoom, only the fret numbers that do not overprint one another.
  const numbers = fretNumbersApart(
    partsOn(picture, 'labels', 'text').filter((label) => label.fret !== 0),
    (label) => fretNumberBox(label.at, label.text, zoom),
  );
  const reference = (role: 'nut-uncompensated' | 'saddle-uncompensated') =>
    [...partsOn(picture, 'nut', 'line'), ...partsOn(picture, 'saddle', 'line')].find((part) => part.role === role);
  const drawn = (layer: 'nut' | 'saddle' | 'centre-line', role: 'nut' | 'saddle' | 'centre-line') =>
    segmentPoints(partsOn(picture, layer, 'line').find((part) => part.role === role)!.segment);
  const outline = partsOn(picture, 'outline', 'polygon')[0]!.points;
  const nutReference = reference('nut-uncompensated');
  const saddleReference = reference('saddle-uncompensated');

  return (
    <Group name="board">
      <Line
        name="outline"
        points={outline.flatMap((p) => [p.x, p.y])}
        closed
        fill={C.board}
        stroke={C.boardEdge}
        strokeWidth={W.outline}
        strokeScaleEnabled={false}
      />
      <Line
        name="perpendicular-line"
        fret={layout.perpendicularFret.fret}
        points={[perpendicularX, bounds.minY - tick, perpendicularX, bounds.maxY + tick]}
        stroke={C.centre}
        strokeWidth={W.reference}
        dash={[...DASHES_PX.perpendicular]}
        strokeScaleEnabled={false}
      />
      {layout.markers.map((marker) => (
        <Group key={`marker-${marker.fret}`} name="marker" fret={marker.fret}>
          {dots
            .filter((dot) => dot.fret === marker.fret)
            .map((dot, index) => (
              <Circle key={index} name={dot.layer === 'face-dots' ? 'marker-dot' : 'side-dot'} x={dot.centre.x} y={dot.centre.y} radius={dot.diameter / 2} fill={C.marker} />
            ))}
        </Group>
      ))}
      {fretLines.map(({ fret = 0, segment }) => (
        <Group key={fret} name="fret">
          <Line
            name="fret-line"
            fret={fret}
            points={segmentPoints(segment)}
            stroke={stopped ? C.fretStopped : C.fret}
            strokeWidth={W.fret}
            strokeScaleEnabled={false}
          />
          <Line
            name="fret-slot"
            fret={fret}
            points={segmentPoints(slots.get(fret) ?? segment)}
            stroke={C.slot}
            strokeWidth={W.slot}
            strokeScaleEnabled={false}
          />
        </Group>
      ))}
      {numbers.map(({ fret, text, at }) => (
        <Text
          key={`number-${fret}`}
          name="fret-number"
          fret={fret}
          text={text}
          x={at.x}
          y={at.y}
          {...labelScale}
          width={fretNumberWidthPx(text)}
          offsetX={fretNumberWidthPx(text) / 2}
          offsetY={-FRET_NUMBER_DROP_PX}
          align="center"
          wrap="none"
          fontFamily={LABEL_FONT.family}
          fontSize={LABEL_FONT.sizePx}
          fill={C.label}
        />
      ))}
      {zeroFret && (
        <Line name="zero-fret-line" points={segmentPoints(zeroFret.segment)} stroke={C.slot} strokeWidth={W.slot} strokeScaleEnabled={false} />
      )}
      <Line
        name="centre-line"
        points={drawn('centre-line', 'centre-line')}
        stroke={C.centre}
        strokeWidth={W.centre}
        dash={[...DASHES_PX.centre]}
        strokeScaleEnabled={false}
      />
      {layout.strings.map((string) => (
        <Line
          key={string.index}
          name="string-line"
          string={string.index}
          scaleLength={string.scaleLength}
          points={[string.nut.x, string.nut.y, string.saddle.x, string.saddle.y]}
          stroke={C.string}
          strokeWidth={W.string}
          strokeScaleEnabled={false}
        />
      ))}
      {nutReference && (
        <Line name="nut-reference-line" points={segmentPoints(nutReference.segment)} stroke={C.reference} strokeWidth={W.reference} dash={[...DASHES_PX.reference]} strokeScaleEnabled={false} />
      )}
      {saddleReference && (
        <Line name="saddle-reference-line" points={segmentPoints(saddleReference.segment)} stroke={C.reference} strokeWidth={W.reference} dash={[...DASHES_PX.reference]} strokeScaleEnabled={false} />
      )}
      <Line name="nut-line" points={drawn('nut', 'nut')} stroke={C.nutSaddle} strokeWidth={W.nutSaddle} strokeScaleEnabled={false} />
      <Line name="saddle-line" points={drawn('saddle', 'saddle')} stroke={C.nutSaddle} strokeWidth={W.nutSaddle} strokeScaleEnabled={false} />
      <Text
        name="perpendicular-label"
        text={layout.perpendicularFret.fret === 0 ? 'nut square to centre line' : `fret ${layout.perpendicularFret.fret} square to centre line`}
        x={perpendicularX}
        y={bounds.maxY}
        {...labelScale}
        offsetY={tick * zoom + 2 * LABEL_FONT.sizePx + 8}
        fontFamily={LABEL_FONT.family}
        fontSize={LABEL_FONT.sizePx}
        fill={C.centre}
      />
      {outerStrings(layout).map(({ index, nut, saddle, scaleLength, side }) => (
        <Text
          key={`scale-${index}`}
          name="scale-label"
          string={index}
          text={`string ${index} scale ${showUnits(scaleLength)}`}
          x={(nut.x + saddle.x) / 2}
          y={(nut.y + saddle.y) / 2}
          {...labelScale}
          rotation={(Math.atan2(saddle.y - nut.y, saddle.x - nut.x) * 180) / Math.PI}
          width={SCALE_LABEL_WIDTH_PX}
          offsetX={SCALE_LABEL_WIDTH_PX / 2}
          align="center"
          offsetY={side === 'treble' ? -(labelGap(layout, side, zoom) + 20) : labelGap(layout, side, zoom) + LABEL_FONT.sizePx + 6}
          fontFamily={LABEL_FONT.family}
          fontSize={LABEL_FONT.sizePx}
          fill={C.label}
        />
      ))}
    </Group>
  );
});

function outerStrings(layout: Layout) {
  const first = layout.strings[0];
  const last = layout.strings[layout.strings.length - 1];
  if (!first || !last) return [];
  return [
    { ...first, side: 'treble' as const },
    { ...last, side: 'bass' as const },
  ];
}

/** Screen distance from an outer string to just beyond the board edge on its side, in px. */
function labelGap(layout: Layout, side: 'treble' | 'bass', zoom: number): number {
  const edge = layout.edges[side];
  const string = side === 'treble' ? layout.strings[0] : layout.strings[layout.strings.length - 1];
  if (!string) return 0;
  const mid: Point = { x: (string.nut.x + string.saddle.x) / 2, y: (string.nut.y + string.saddle.y) / 2 };
  const edgeMidY = (edge.start.y + edge.end.y) / 2;
  return Math.abs(edgeMidY - mid.y) * zoom + 4;
}
