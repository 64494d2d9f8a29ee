import type { TilePlan } from '~/lib/export/tile-pages.ts';
import type { Point } from '~/lib/geometry/layout.ts';

interface Props {
  plan: TilePlan;
  /** Board outline in sheet millimetres. */
  outline: readonly Point[];
}

/** The page grid over the board, as the paper template's page map shows it (y flipped for SVG). */
export function TilingPreview({ plan, outline }: Props) {
  const minX = Math.min(...plan.tiles.map((t) => t.x0));
  const minY = Math.min(...plan.tiles.map((t) => t.y0));
  const maxX = Math.max(...plan.tiles.map((t) => t.x0)) + plan.window.widthMm;
  const maxY = Math.max(...plan.tiles.map((t) => t.y0)) + plan.window.heightMm;
  const stroke = Math.max(maxX - minX, maxY - minY) / 300;
  return (
    <svg
      role="img"
      aria-label={`Page tiling: ${plan.tiles.length} page${plan.tiles.length === 1 ? '' : 's'}`}
      viewBox={`${minX} ${-maxY} ${maxX - minX} ${maxY - minY}`}
      className="h-40 w-full rounded border border-paper-line bg-white"
      data-pages={plan.tiles.length}
    >
      {plan.tiles.map((tile) => (
        <g key={tile.index}>
          <rect
            x={tile.x0}
            y={-(tile.y0 + plan.window.heightMm)}
            width={plan.window.widthMm}
            height={plan.window.heightMm}
            fill="#e3eeea"
            fillOpacity={0.5}
            stroke="#2f5d50"
            strokeWidth={stroke}
          />
          <text
            x={tile.x0 + stroke * 6}
            y={-(tile.y0 + plan.window.heightMm) + stroke * 24}
            fontSize={stroke * 20}
            fill="#2f5d50"
          >
            {tile.index + 1}
          </text>
        </g>
      ))}
      <polygon points={outline.map((p) => `${p.x},${-p.y}`).join(' ')} fill="none" stroke="#1f2328" strokeWidth={stroke * 1.5} />
    </svg>
  );
}
