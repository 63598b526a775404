import type uPlot from 'uplot';

// Canvas pixels per CSS pixel, as uPlot set the canvas up (a type-only import keeps uPlot out of the page chunk).
const ratioOf = (u: uPlot) => u.ctx.canvas.width / u.width || 1;

/** Canvas helpers for the marks uPlot does not draw itself; every value is in scale units, clipped to the plot. */
function clipped(u: uPlot, draw: (ctx: CanvasRenderingContext2D) => void) {
  const { ctx, bbox } = u;
  ctx.save();
  ctx.beginPath();
  ctx.rect(bbox.left, bbox.top, bbox.width, bbox.height);
  ctx.clip();
  draw(ctx);
  ctx.restore();
}

export interface XRange {
  from: number;
  to: number;
  fill: string;
  /** Diagonal lines over the band in this colour: a pattern, so two kinds of band differ by more than colour. */
  hatch?: string;
  /** A solid downward triangle at the top of the band in this colour: a shape that shows even on a 3 px band. */
  marker?: string;
}

function hatchBand(ctx: CanvasRenderingContext2D, x: number, top: number, width: number, height: number, stroke: string, px: number) {
  ctx.save();
  ctx.beginPath();
  ctx.rect(x, top, width, height);
  ctx.clip();
  ctx.strokeStyle = stroke;
  ctx.lineWidth = 1.5 * px;
  const gap = 6 * px;
  ctx.beginPath();
  for (let offset = -height; offset < width; offset += gap) {
    ctx.moveTo(x + offset, top + height);
    ctx.lineTo(x + offset + height, top);
  }
  ctx.stroke();
  ctx.restore();
}

function triangleAt(ctx: CanvasRenderingContext2D, centre: number, top: number, colour: string, px: number) {
  const half = 5 * px;
  ctx.fillStyle = colour;
  ctx.beginPath();
  ctx.moveTo(centre - half, top);
  ctx.lineTo(centre + half, top);
  ctx.lineTo(centre, top + 8 * px);
  ctx.closePath();
  ctx.fill();
}

/** Vertical bands, never thinner than 3 px, so a ten-second dip still shows on a ten-hour night. */
export function shadeXRanges(u: uPlot, ranges: readonly XRange[]) {
  const px = ratioOf(u);
  const minWidth = 3 * px;
  clipped(u, (ctx) => {
    for (const range of ranges) {
      const x0 = u.valToPos(range.from, 'x', true);
      const x1 = u.valToPos(range.to, 'x', true);
      const width = Math.max(x1 - x0, minWidth);
      const left = x0 - (width - (x1 - x0)) / 2;
      ctx.fillStyle = range.fill;
      ctx.fillRect(left, u.bbox.top, width, u.bbox.height);
      if (range.hatch) hatchBand(ctx, left, u.bbox.top, width, u.bbox.height, range.hatch, px);
      if (range.marker) triangleAt(ctx, left + width / 2, u.bbox.top, range.marker, px);
    }
  });
}

export function shadeYRange(u: uPlot, from: number, to: number, fill: string) {
  clipped(u, (ctx) => {
    const y0 = u.valToPos(to, 'y', true);
    const y1 = u.valToPos(from, 'y', true);
    ctx.fillStyle = fill;
    ctx.fillRect(u.bbox.left, y0, u.bbox.width, y1 - y0);
  });
}

/** A dashed horizontal line with its value written on it, so the line is readable without its colour. */
export function drawHorizontalLine(u: uPlot, value: number, stroke: string, label: string, font: string) {
  const px = ratioOf(u);
  clipped(u, (ctx) => {
    const y = Math.round(u.valToPos(value, 'y', true));
    ctx.strokeStyle = stroke;
    ctx.lineWidth = 1.5 * px;
    ctx.setLineDash([6 * px, 4 * px]);
    ctx.beginPath();
    ctx.moveTo(u.bbox.left, y);
    ctx.lineTo(u.bbox.left + u.bbox.width, y);
    ctx.stroke();
    ctx.setLineDash([]);
    // Under the line at the left, on a light patch: the trace sits above the threshold most of the night.
    ctx.font = font.replace(/^(\d+)px/, (_m, size: string) => `bold ${Number(size) * px}px`);
    ctx.textAlign = 'left';
    ctx.textBaseline = 'top';
    const x = u.bbox.left + 6 * px;
    const width = ctx.measureText(label).width;
    ctx.fillStyle = 'rgba(255, 255, 255, 0.85)';
    ctx.fillRect(x - 2 * px, y + 2 * px, width + 4 * px, 15 * px);
    ctx.fillStyle = stroke;
    ctx.fillText(label, x, y + 3 * px);
  });
}
