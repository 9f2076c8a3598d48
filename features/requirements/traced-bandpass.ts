/**
 * The traced FWHM bandpass a `bandpassBasis: 'traced'` requirement is judged on. Tracing costs far
 * more than the closed forms (the check runs on every edit), so it is done at few wavelengths with
 * a modest ray count: at `atWavelengthsNm` when listed, else at the range's start, quarter points,
 * centre and end — never the whole sweep.
 */

import type { Design } from '../../shared/design';
import { tracedBandpasses } from '../trace/index';

/**
 * Rays per traced wavelength for the requirement: enough for the line shape's half-maximum to
 * settle to a few per cent, a fraction of the trace card's default (TRACE_LIMITS.defaultRays).
 */
export const TRACED_REQUIREMENT_RAYS = 1500;

/** One wavelength's traced bandpass; `fwhmNm` null where the trace finds no half-maximum width. */
export interface TracedBandpass {
  wavelengthNm: number;
  reachable: boolean;
  fwhmNm: number | null;
  slitLimitedNm: number | null;
}

export type TracedBandpasses = { ok: true; points: TracedBandpass[] } | { ok: false; reason: string };

/** Range start, quarter points, centre and end: the shape of the blur across the range at five traces. */
export function tracedRequirementWavelengthsNm(design: Design): number[] {
  const { startNm, endNm } = design.range;
  return [0, 0.25, 0.5, 0.75, 1].map((share) => startNm + share * (endNm - startNm));
}

/**
 * Recent answers by the optics they were traced for (the design without its requirements), the
 * wavelengths and the ray count: typing a limit, or a second check of the same design on one
 * screen, does not trace again (about 10 ms a trace on this machine, inside an edit's frame).
 * A Map in insertion order dropping its oldest, not lru-cache: this module ships in the web
 * bundle, and 32 entries need no more.
 */
const recent = new Map<string, TracedBandpasses>();
const RECENT_MAX = 32;

/** Forgets the remembered traces (for tests that stand in for the engine). */
export function clearTracedBandpassCache(): void {
  recent.clear();
}

/**
 * The traced FWHM at `wavelengthsNm` (order kept as given), or why the trace could not run. The
 * engine's lean path traces only the whole slit at each wavelength (no spots, foci or tilt), with
 * the same rays `traceDesign` uses at this ray count, so the figure is the card's.
 */
export function tracedBandpassesAt(
  design: Design,
  wavelengthsNm: readonly number[],
  rays = TRACED_REQUIREMENT_RAYS,
): TracedBandpasses {
  const { requirements: _requirements, ...optics } = design;
  void _requirements;
  const key = JSON.stringify([optics, wavelengthsNm, rays]);
  const known = recent.get(key);
  if (known) return known;
  const answer = traceAt(design, wavelengthsNm, rays);
  // A failure is not kept: an engine that could not run this time is asked again next time.
  if (answer.ok) {
    recent.set(key, answer);
    if (recent.size > RECENT_MAX) recent.delete(recent.keys().next().value!);
  }
  return answer;
}

function traceAt(design: Design, wavelengthsNm: readonly number[], rays: number): TracedBandpasses {
  try {
    const traced = tracedBandpasses(design, wavelengthsNm, rays);
    return {
      ok: true,
      points: wavelengthsNm.map((wavelengthNm, i): TracedBandpass => {
        const found = traced[i];
        // A wavelength the engine did not answer for is not silently dropped: it reads as untraced.
        if (!found) return { wavelengthNm, reachable: true, fwhmNm: null, slitLimitedNm: null };
        return {
          wavelengthNm,
          reachable: found.reachable,
          fwhmNm: found.reachable && found.fwhmNm !== null && Number.isFinite(found.fwhmNm) ? found.fwhmNm : null,
          slitLimitedNm: found.reachable && found.slitLimitedNm !== null && Number.isFinite(found.slitLimitedNm) ? found.slitLimitedNm : null,
        };
      }),
    };
  } catch (error) {
    return { ok: false, reason: error instanceof Error ? error.message : String(error) };
  }
}
