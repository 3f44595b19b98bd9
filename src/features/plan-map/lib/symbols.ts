/** Our point symbols (DESIGN.md): one SVG path per symbol, drawn on canvas for the map and as SVG in the ledger. */
import { KIND_STYLES, POINT_KINDS, type PointSymbol, type UnitKind } from '../../../../shared/domain/unit-kinds';

/** An SVG path of the symbol inside a size × size box. */
export function symbolPath(symbol: PointSymbol, size: number): string {
  const m = size * 0.14;
  const c = size / 2;
  const f = (v: number) => Number(v.toFixed(2));
  switch (symbol) {
    case 'triangle':
      return `M${f(c)} ${f(m)}L${f(size - m)} ${f(size - m * 1.3)}L${f(m)} ${f(size - m * 1.3)}Z`;
    case 'square':
      return `M${f(m * 1.4)} ${f(m * 1.4)}H${f(size - m * 1.4)}V${f(size - m * 1.4)}H${f(m * 1.4)}Z`;
    case 'diamond':
      return `M${f(c)} ${f(m)}L${f(size - m)} ${f(c)}L${f(c)} ${f(size - m)}L${f(m)} ${f(c)}Z`;
    case 'circle': {
      const r = c - m * 1.2;
      return `M${f(c - r)} ${f(c)}A${f(r)} ${f(r)} 0 1 0 ${f(c + r)} ${f(c)}A${f(r)} ${f(r)} 0 1 0 ${f(c - r)} ${f(c)}Z`;
    }
    case 'bar': {
      const h = size * 0.3;
      return `M${f(m)} ${f(c - h / 2)}H${f(size - m)}V${f(c + h / 2)}H${f(m)}Z`;
    }
  }
}

/** The map image name of a point kind's symbol. */
export const symbolImageId = (kind: UnitKind): string => `browseline-${kind}`;

/** Logical size of the symbols on the map, in CSS pixels. */
export const SYMBOL_SIZE_PX = 22;

/**
 * The symbol of each point kind as RGBA pixels (drawn on a canvas at the device pixel ratio), to
 * add with map.addImage: our own images, no sprite file.
 */
export function drawKindSymbols(pixelRatio: number): { id: string; image: ImageData; pixelRatio: number }[] {
  const size = Math.round(SYMBOL_SIZE_PX * pixelRatio);
  const out: { id: string; image: ImageData; pixelRatio: number }[] = [];
  for (const kind of POINT_KINDS) {
    const style = KIND_STYLES[kind];
    const canvas = document.createElement('canvas');
    canvas.width = size;
    canvas.height = size;
    const ctx = canvas.getContext('2d');
    if (!ctx) continue;
    const path = new Path2D(symbolPath(style.symbol ?? 'circle', size));
    ctx.lineJoin = 'round';
    ctx.strokeStyle = 'rgba(31,42,36,0.45)';
    ctx.lineWidth = 4.5 * pixelRatio;
    ctx.stroke(path);
    ctx.strokeStyle = style.stroke;
    ctx.lineWidth = 2.6 * pixelRatio;
    ctx.stroke(path);
    ctx.fillStyle = style.fill;
    ctx.fill(path);
    out.push({ id: symbolImageId(kind), image: ctx.getImageData(0, 0, size, size), pixelRatio });
  }
  return out;
}
