/**
 * The pure parts of a spot diagram: the square window (equal mm per pixel along x and y), the
 * rays drawn as one path of pixel-sized dots (a dot per occupied pixel, so 20 000 rays cost no
 * more to draw than the diagram has pixels), and a scale bar of a round length. No React.
 */

/** A square window on the image plane, mm, with its size on screen. */
export interface SpotWindow {
  centreXMm: number;
  centreYMm: number;
  /** Half the side of the square, mm: the same along x and y. */
  halfMm: number;
  sizePx: number;
}

/** Share of the window the farthest ray or the slit's edge may reach from its centre. */
const FILL = 0.85;

/**
 * The window around a spot: centred on its centroid, wide enough for every ray and for the exit
 * slit (or pixel) of `aperture.widthMm` centred at `aperture.centreXMm`. A slit far off the spot
 * (more than four spot widths) is left outside rather than shrinking the spot to a dot. Never
 * narrower than `minHalfMm`, so a perfect point image still has a size.
 */
export function spotWindow(
  x: ArrayLike<number>,
  y: ArrayLike<number>,
  centroid: { x: number; y: number },
  aperture: { centreXMm: number; widthMm: number },
  sizePx: number,
  minHalfMm = 0.001,
): SpotWindow {
  let rays = 0;
  for (let i = 0; i < x.length; i += 1) {
    const dx = Math.abs((x[i] as number) - centroid.x);
    const dy = Math.abs((y[i] as number) - centroid.y);
    if (Number.isFinite(dx) && dx > rays) rays = dx;
    if (Number.isFinite(dy) && dy > rays) rays = dy;
  }
  const half = aperture.widthMm / 2;
  const slit = Math.max(Math.abs(aperture.centreXMm - half - centroid.x), Math.abs(aperture.centreXMm + half - centroid.x));
  const reach = slit <= 4 * Math.max(rays, half) ? Math.max(rays, slit) : Math.max(rays, half);
  return { centreXMm: centroid.x, centreYMm: centroid.y, halfMm: Math.max(minHalfMm, reach / FILL), sizePx };
}

/** Screen position of an image-plane point, px: x to the right, y (the slit's top) up. */
export function toPx(window: SpotWindow, xMm: number, yMm: number): { px: number; py: number } {
  const perMm = window.sizePx / (2 * window.halfMm);
  return {
    px: window.sizePx / 2 + (xMm - window.centreXMm) * perMm,
    py: window.sizePx / 2 - (yMm - window.centreYMm) * perMm,
  };
}

/**
 * One SVG path with a 1×1 px square at every pixel a ray lands in, and how many such pixels there
 * are. Rays outside the window (none, by construction of `spotWindow`) are left out.
 */
export function spotDots(window: SpotWindow, x: ArrayLike<number>, y: ArrayLike<number>): { d: string; dots: number } {
  const size = Math.max(1, Math.round(window.sizePx));
  const seen = new Uint8Array(size * size);
  const parts: string[] = [];
  for (let i = 0; i < x.length; i += 1) {
    const { px, py } = toPx(window, x[i] as number, y[i] as number);
    const col = Math.floor(px);
    const row = Math.floor(py);
    if (!(col >= 0 && col < size && row >= 0 && row < size)) continue;
    const cell = row * size + col;
    if (seen[cell]) continue;
    seen[cell] = 1;
    parts.push(`M${col} ${row}h1v1h-1z`);
  }
  return { d: parts.join(''), dots: parts.length };
}

/**
 * A scale bar of a round length (1, 2 or 5 × 10ⁿ µm) no longer than `maxShare` of the window's
 * side, with its length in px and its label ("20 µm", "1 mm").
 */
export function scaleBar(window: SpotWindow, maxShare = 0.4): { lengthPx: number; label: string } {
  const maxUm = 2 * window.halfMm * 1000 * maxShare;
  const decade = 10 ** Math.floor(Math.log10(maxUm));
  const step = [5, 2, 1].map((k) => k * decade).find((um) => um <= maxUm) ?? decade;
  const lengthPx = (step / 1000) * (window.sizePx / (2 * window.halfMm));
  const label = step >= 1000 ? `${step / 1000}\u00A0mm` : step >= 1 ? `${step}\u00A0µm` : `${Number(step.toPrecision(1))}\u00A0µm`;
  return { lengthPx, label };
}
