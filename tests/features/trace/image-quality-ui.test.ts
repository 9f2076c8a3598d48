import { describe, expect, it } from 'vitest';
import { bandpassWords, comaWords, focusWords, micrometres, traceStatusWords } from '../../../features/trace/image-quality-words';
import { scaleBar, spotDots, spotWindow, toPx } from '../../../features/trace/spot-figure';
import { latestOnly } from '../../../features/trace/trace-queue';
import { lineShapeWindow } from '../../../features/trace/line-shape-window';

/** A promise with its resolve handed out, to finish runs in the order a test chooses. */
function deferred<T>() {
  let resolve!: (value: T) => void;
  const promise = new Promise<T>((r) => (resolve = r));
  return { promise, resolve };
}
const settle = () => new Promise((r) => setTimeout(r, 0));

describe('the live trace runs only the latest request', () => {
  it('runs one at a time, keeps only the newest waiting request and drops a replaced result', async () => {
    const runs: { request: string; done: ReturnType<typeof deferred<string>> }[] = [];
    const delivered: string[] = [];
    const busy: boolean[] = [];
    const queue = latestOnly<string, string>(
      (request) => {
        const done = deferred<string>();
        runs.push({ request, done });
        return done.promise;
      },
      { onResult: (result) => delivered.push(result), onError: () => delivered.push('error'), onBusy: (b) => busy.push(b) },
    );
    queue.submit('a');
    queue.submit('b');
    queue.submit('c');
    // "a" runs; "b" was replaced by "c" while waiting and never runs.
    expect(runs.map((r) => r.request)).toEqual(['a']);
    runs[0]!.done.resolve('traced a');
    await settle();
    // "a" is stale ("c" was asked for since): not delivered; "c" starts at once.
    expect(delivered).toEqual([]);
    expect(runs.map((r) => r.request)).toEqual(['a', 'c']);
    runs[1]!.done.resolve('traced c');
    await settle();
    expect(delivered).toEqual(['traced c']);
    expect(busy).toEqual([true, false]);
  });

  it('reports a failure of the latest request, and nothing after it is disposed', async () => {
    const delivered: string[] = [];
    let fail = true;
    const queue = latestOnly<string, string>(
      (request) => (fail ? Promise.reject(new Error(`no ${request}`)) : Promise.resolve(request)),
      { onResult: (r) => delivered.push(r), onError: (e) => delivered.push((e as Error).message) },
    );
    queue.submit('x');
    await settle();
    expect(delivered).toEqual(['no x']);
    fail = false;
    queue.dispose();
    queue.submit('y');
    await settle();
    expect(delivered).toEqual(['no x']);
  });
});

describe('a spot diagram', () => {
  it('keeps x and y at one scale and shows the whole exit slit around a small spot', () => {
    // Rays within ±5 µm of the centroid, a 100 µm slit centred on it: the slit's half-width (0.05 mm)
    // sets the reach; the window's half-side is reach / 0.85 (the fill share).
    const x = [0.995, 1.005, 1];
    const y = [2, 2, 2.004];
    const window = spotWindow(x, y, { x: 1, y: 2 }, { centreXMm: 1, widthMm: 0.1 }, 100);
    expect(window.halfMm).toBeCloseTo(0.05 / 0.85, 12);
    // Equal scale: a 0.01 mm step right and one up move the same number of pixels.
    const origin = toPx(window, 1, 2);
    expect(toPx(window, 1.01, 2).px - origin.px).toBeCloseTo(origin.py - toPx(window, 1, 2.01).py, 12);
    expect(origin).toEqual({ px: 50, py: 50 });
  });

  it('lets a slit far from the spot fall outside rather than shrink the spot to a dot', () => {
    // Slit 1 mm away, spot 10 µm across: 1 mm > 4 × 0.05 mm, so the spot or half-slit sets the window.
    const window = spotWindow([0.995, 1.005], [0, 0], { x: 1, y: 0 }, { centreXMm: 0, widthMm: 0.1 }, 100);
    expect(window.halfMm).toBeCloseTo(0.05 / 0.85, 12);
  });

  it('draws one dot per occupied pixel however many rays land there', () => {
    const window = { centreXMm: 0, centreYMm: 0, halfMm: 1, sizePx: 10 };
    // 1000 rays on one point and one ray elsewhere: two dots.
    const x = [...Array.from({ length: 1000 }, () => 0), 0.5];
    const y = [...Array.from({ length: 1000 }, () => 0), 0.5];
    const { d, dots } = spotDots(window, x, y);
    expect(dots).toBe(2);
    // (0.5, 0.5) mm → px 5 + 0.5·5 = 7.5, py 5 − 2.5 = 2.5: the pixel at column 7, row 2.
    expect(d).toContain('M7 2h1v1h-1z');
  });

  it('picks a round scale bar no longer than 40 % of the side', () => {
    // Side 2 × 0.06 mm = 120 µm; 40 % is 48 µm; the round lengths below are 20 µm (then 10, 5…).
    const bar = scaleBar({ centreXMm: 0, centreYMm: 0, halfMm: 0.06, sizePx: 120 });
    expect(bar.label).toBe('20\u00A0µm');
    // 120 px for 120 µm: 1 px per µm.
    expect(bar.lengthPx).toBeCloseTo(20, 9);
  });
});

describe('the image quality in words', () => {
  it('says which side of the image plane a focus lies', () => {
    expect(focusWords(0.12)).toBe('0.12\u00A0mm beyond the image plane');
    expect(focusWords(-0.5)).toBe('0.5\u00A0mm before the image plane');
    expect(focusWords(0.0001)).toBe('at the image plane');
  });

  it('names coma by the spot’s skew and the side its flare points to', () => {
    expect(comaWords({ comaSkew: 0.05, comaMm: 0.001 })).toMatch(/^No coma/);
    expect(comaWords({ comaSkew: 0.4, comaMm: 0.002 })).toMatch(/^Slight coma: the spot flares toward longer/);
    expect(comaWords({ comaSkew: -1.2, comaMm: -0.004 })).toMatch(/^Strong coma: the spot flares toward shorter.*4\u00A0µm/);
  });

  it('compares the traced FWHM with the slit-limited one', () => {
    // 0.275 / 0.25 = 1.10: 10 % wider.
    expect(bandpassWords({ tracedFwhmNm: 0.275, slitLimitedFwhmNm: 0.25 })).toBe(
      'Traced FWHM 0.275\u00A0nm against the slit-limited 0.25\u00A0nm: 10\u202F% wider.',
    );
    expect(bandpassWords({ tracedFwhmNm: null, slitLimitedFwhmNm: 0.25 })).toMatch(/no clear half-maximum width/);
  });

  it('writes small lengths in micrometres and a status line for each state', () => {
    expect(micrometres(0.0123)).toBe('12.3\u00A0µm');
    expect(traceStatusWords({ tracing: true, failure: null, elapsedMs: 40, rays: 4000 })).toBe('Tracing…');
    // Grouped as every count in the product is (shared/format.ts), whichever separator that is.
    expect(traceStatusWords({ tracing: false, failure: null, elapsedMs: 40.4, rays: 20_000 })).toMatch(/^Traced 20\D?000 rays per wavelength in 40 ms\.$/);
    expect(traceStatusWords({ tracing: false, failure: 'bad design', elapsedMs: null, rays: null })).toMatch(/could not run: bad design/);
  });
});


describe('the line shape plot', () => {
  it('draws the stretch where either curve shows, with a margin, not the whole sampled range', () => {
    // 21 samples; the traced line is above the floor at 9–11, the trapezoid at 8–12: 5 samples,
    // padded by ceil(5 × 0.3) = 2 on each side → samples 6 to 14.
    const offsets = Array.from({ length: 21 }, (_, i) => i - 10);
    const traced = offsets.map((o) => (Math.abs(o) <= 1 ? 1 - Math.abs(o) / 2 : 0));
    const trapezoid = offsets.map((o) => (Math.abs(o) <= 2 ? 1 - Math.abs(o) / 4 : 0));
    expect(lineShapeWindow(offsets, [traced, trapezoid])).toEqual({ from: 6, to: 14 });
    // Nothing above the floor: the whole range, rather than nothing.
    expect(lineShapeWindow(offsets, [offsets.map(() => 0)])).toEqual({ from: 0, to: 20 });
  });
});
