import { describe, expect, it } from 'vitest';
import { checkRequirements } from '@/features/requirements';
import {
  DEFAULT_TRADE_STUDY_OPTIONS,
  TRADE_SELECTOR_IDS,
  evaluateDesign,
  tradeStudy,
  tradeStudyOptionIssues,
  resolveTradeStudyOptions,
  type SelectorStudy,
  type TradeSelectorId,
  type TradeStudy,
  type TradeVerdictId,
} from '@/features/solver';
import type { Design } from '@/shared/design';
import type { Requirements } from '@/shared/requirements';
import { expectClose } from './close-to';
import { makeDesign } from './fixtures';

const selector = (study: TradeStudy, id: TradeSelectorId): SelectorStudy => study.selectors.find((s) => s.id === id)!;
const verdict = (study: TradeStudy, row: TradeVerdictId, id: TradeSelectorId) =>
  study.verdicts.find((r) => r.id === row)?.verdicts[id];
const at = (study: TradeStudy, s: SelectorStudy, wavelengthNm: number, key: 'bandpassNm' | 'resolvingPower') =>
  s[key][study.wavelengthsNm.findIndex((w) => Math.abs(w - wavelengthNm) < 1e-9)];

const withRequirements = (design: Design, requirements: Requirements): Design => ({ ...design, requirements });

describe('the four selectors side by side', () => {
  it('lists the grating, the prism, the interference filter and the coloured glass, in that order', () => {
    const study = tradeStudy(makeDesign());
    expect(study.selectors.map((s) => s.id)).toEqual([...TRADE_SELECTOR_IDS]);
    for (const s of study.selectors) {
      expect(s.bandpassNm).toHaveLength(study.wavelengthsNm.length);
      expect(s.resolvingPower).toHaveLength(study.wavelengthsNm.length);
    }
  });

  it('the prism resolves R = b|dn/dλ| when the slits are closed: 50 mm of fused silica at 500 nm, about 2768', () => {
    // Born & Wolf, §4.7 (Hecht, §5.5): R = b |dn/dλ|. dn/dλ(500 nm) = −5.53564e-5 /nm by hand from
    // Malitson 1965's coefficients (worked in sellmeier.test.ts); b = 50 mm = 5e7 nm → 2767.82.
    // Slits of 0.001 µm leave a slit bandpass of ~4e-5 nm against λ/R = 0.18 nm, so the delivered
    // R (quadrature) equals b|dn/dλ| to ~1e-8.
    const design = makeDesign({
      range: { startNm: 400, endNm: 500 },
      slits: { entranceWidthUm: 0.001, exitWidthUm: 0.001 },
      grating: { ruledWidthMm: 50 },
    });
    const study = tradeStudy(design);
    expectClose(at(study, selector(study, 'prism'), 500, 'resolvingPower'), 2767.82, 1e-5);
  });

  it('the prism’s bandpass with the design’s mirrors and slits: 4.108 nm at 500 nm for 100 µm slits and 300 mm mirrors', () => {
    // Born & Wolf, §4.7: dD/dλ = 2 sin(A/2)/√(1 − n² sin²(A/2)) |dn/dλ|. n(500) = 1.4623265 (Malitson 1965,
    // by hand in sellmeier.test.ts): n² sin²30° = 0.5345997, √(1 − that) = 0.682203, so
    // dD/dλ = 5.53564e-5 / 0.682203 = 8.11436e-5 rad/nm. Reciprocal dispersion 1/(300 mm · that)
    // = 41.0798 nm/mm; slit-limited bandpass (equal slits, unit magnification) 41.0798 × 0.1 mm = 4.10798 nm.
    const study = tradeStudy(makeDesign({ range: { startNm: 400, endNm: 500 } }));
    const prism = selector(study, 'prism');
    expectClose(at(study, prism, 500, 'bandpassNm'), 4.10798, 1e-4);
    // Delivered R = λ/√(bandpass² + (λ/b|dn/dλ|)²) = 500/√(4.10798² + 0.180648²) = 500/4.111950 = 121.597.
    expectClose(at(study, prism, 500, 'resolvingPower'), 121.597, 1e-4);
  });

  it('the prism’s bandpass grows toward the red: its dispersion is not linear in wavelength', () => {
    // |dn/dλ| of glass falls steeply toward longer wavelengths (normal dispersion, Born & Wolf, §2.3),
    // so the slit bandpass grows several-fold over 380–780 nm while the grating's barely changes.
    const study = tradeStudy(makeDesign({ range: { startNm: 380, endNm: 780 } }));
    const prism = selector(study, 'prism').bandpassSpanNm!;
    const grating = selector(study, 'grating').bandpassSpanNm!;
    expect(prism[1] / prism[0]).toBeGreaterThan(4);
    expect(grating[1] / grating[0]).toBeLessThan(1.2);
  });

  it('the interference filter is FWHM = FSR / finesse wide, FSR = λ/m: 9.797 nm at 600 nm for R = 0.95, first order', () => {
    // Hecht, Optics, §9.6: finesse π√R/(1 − R) = π·0.974679/0.05 = 61.2408; FSR = 600 nm / 1;
    // FWHM = 600/61.2408 = 9.7974 nm; R = λ/FWHM = 61.2408.
    const study = tradeStudy(makeDesign({ range: { startNm: 500, endNm: 600 } }));
    const filter = selector(study, 'interference-filter');
    expectClose(at(study, filter, 600, 'bandpassNm'), 9.7974, 1e-4);
    expectClose(at(study, filter, 600, 'resolvingPower'), 61.2408, 1e-4);
  });

  it('counts the filters it takes to cover the range by tilting up to 20°', () => {
    // Hecht, §9.6: λ(θ) = λ₀√(1 − (sin θ/n)²). n = 1.45, θ = 20°: sin 20° / 1.45 = 0.235876,
    // √(1 − 0.055637) = 0.971784 — one filter tunes 2.82 % down. 500–550 nm: ln 1.1 / −ln 0.971784
    // = 0.095310 / 0.028622 = 3.33 → 4 filters; 500–510 nm: 0.019803 / 0.028622 = 0.69 → 1.
    const wide = tradeStudy(makeDesign({ range: { startNm: 500, endNm: 550 } }));
    expect(selector(wide, 'interference-filter').unitsToCover).toBe(4);
    const narrow = tradeStudy(makeDesign({ range: { startNm: 500, endNm: 510 } }));
    expect(selector(narrow, 'interference-filter').unitsToCover).toBe(1);
  });

  it('counts the 100 nm glasses it takes to span the range', () => {
    // (780 − 380) / 100 = 4 glasses side by side; 300–900: 6.
    expect(selector(tradeStudy(makeDesign({ range: { startNm: 380, endNm: 780 } })), 'coloured-glass').unitsToCover).toBe(4);
    expect(selector(tradeStudy(makeDesign()), 'coloured-glass').unitsToCover).toBe(6);
  });
});

describe('peak transmission estimates', () => {
  it('grating: blaze peak × coating × two mirrors, 0.9³ = 0.729 when the blaze lies in the range', () => {
    // Aluminium at 90 % (common practice) on the grating and two mirrors; the scalar blaze
    // efficiency is 1 at the blaze (Palmer & Loewen, ch. 9), within 0.01 % on the 6 nm sweep.
    const grating = selector(tradeStudy(makeDesign()), 'grating');
    expectClose(grating.peakTransmission, 0.729, 1e-3);
    expect(grating.peakTransmissionBasis).toMatch(/common practice/);
  });

  it('grating without a blaze wavelength: no estimate, and says why', () => {
    const design = makeDesign();
    delete design.grating.blazeWavelengthNm;
    const grating = selector(tradeStudy(design), 'grating');
    expect(grating.peakTransmission).toBeNull();
    expect(grating.peakTransmissionBasis).toMatch(/No blaze wavelength/);
  });

  it('prism: two Fresnel faces × two mirrors, 0.7539 for fused silica at 500 nm', () => {
    // Hecht, §4.6: ρ = ((n − 1)/(n + 1))², n(500 nm) = 1.4623265 (Malitson 1965) → ρ = 0.187760² = 0.035254;
    // (1 − ρ)² = 0.930735; × 0.9² = 0.753895. Over 400–500 nm the index is lowest at 500 nm.
    const prism = selector(tradeStudy(makeDesign({ range: { startNm: 400, endNm: 500 } })), 'prism');
    expectClose(prism.peakTransmission, 0.753895, 1e-5);
  });

  it('interference filter: the lossless Airy peak is 1, with a note on real filters', () => {
    // Born & Wolf, §7.6: T = 1/(1 + F sin²(δ/2)) is 1 at a peak for lossless mirrors.
    const filter = selector(tradeStudy(makeDesign()), 'interference-filter');
    expectClose(filter.peakTransmission, 1, 1e-12);
    expect(filter.peakTransmissionBasis).toMatch(/Real all-dielectric filters/);
  });

  it('coloured glass: plateau × two surfaces, 0.85 × (1 − 0.0426)² = 0.7790', () => {
    // Hecht, §4.6: n = 1.52 → ρ = (0.52/2.52)² = 0.042580; (1 − ρ)² = 0.916653; × 0.85 = 0.779155.
    // The band centre sits 50 nm from 30 nm-wide edges, whose logistic tails take about 0.1 % more.
    const glass = selector(tradeStudy(makeDesign()), 'coloured-glass');
    expectClose(glass.peakTransmission, 0.779155, 2e-3);
  });
});

describe('overlapping orders: within one octave and beyond', () => {
  const noSource = (startNm: number, endNm: number) => makeDesign({ range: { startNm, endNm }, source: undefined });

  it('within one octave (400–700 nm, source = range) neither the grating nor the filter has another order in the range', () => {
    // Palmer & Loewen, ch. 2: order 2 brings λ/2 ≥ 400 nm only at λ ≥ 800 nm; the cavity's next peak is λ/2 too (Hecht, §9.6).
    const study = tradeStudy(noSource(400, 700));
    for (const s of study.selectors) expect(s.hasOverlappingOrders, s.id).toBe(false);
  });

  it('beyond an octave (300–900 nm) the grating and the filter overlap, the prism and the glass never do', () => {
    const study = tradeStudy(noSource(300, 900));
    expect(selector(study, 'grating').hasOverlappingOrders).toBe(true);
    expect(selector(study, 'interference-filter').hasOverlappingOrders).toBe(true);
    expect(selector(study, 'interference-filter').overlappingOrders).toMatch(/blocking filter/);
    expect(selector(study, 'prism').hasOverlappingOrders).toBe(false);
    expect(selector(study, 'coloured-glass').hasOverlappingOrders).toBe(false);
  });
});

describe('verdicts per requirement', () => {
  it('without requirements: the figures, no verdict rows, and a note that none are set', () => {
    const study = tradeStudy(makeDesign());
    expect(study.verdicts).toEqual([]);
    expect(study.verdictNote).toMatch(/No requirements are set/);
  });

  it('a bandpass the grating meets and the prism does not (0.5 nm over 380–780 nm)', () => {
    // The example grating (1200/mm, 300 mm, 100 µm) is ~0.27 nm wide; the prism is wider than 1.7 nm
    // everywhere (4.1 nm at 500 nm by hand above, and wider toward the red as 1/|dn/dλ|, Born & Wolf §4.7).
    const study = tradeStudy(withRequirements(makeDesign({ range: { startNm: 380, endNm: 780 } }), { maxBandpassNm: 0.5 }));
    expect(verdict(study, 'maxBandpassNm', 'grating')?.status).toBe('pass');
    expect(verdict(study, 'maxBandpassNm', 'prism')?.status).toBe('fail');
    expect(verdict(study, 'maxBandpassNm', 'coloured-glass')?.status).toBe('fail');
    expect(verdict(study, 'maxBandpassNm', 'prism')?.message).toMatch(/over/);
  });

  it('the reverse: forbidding other orders fails the grating over 300–900 nm and passes the prism and the glass', () => {
    const study = tradeStudy(withRequirements(makeDesign(), { orderOverlap: 'forbidden' }));
    expect(verdict(study, 'orderOverlap', 'grating')?.status).toBe('fail');
    expect(verdict(study, 'orderOverlap', 'prism')?.status).toBe('pass');
    expect(verdict(study, 'orderOverlap', 'coloured-glass')?.status).toBe('pass');
    expect(verdict(study, 'orderOverlap', 'interference-filter')?.status).toBe('fail');
  });

  it('a first row says whether one selector covers the range', () => {
    const study = tradeStudy(withRequirements(makeDesign(), { maxBandpassNm: 1 }));
    const row = study.verdicts[0]!;
    expect(row.id).toBe('coverage');
    expect(row.verdicts.grating.status).toBe('pass');
    expect(row.verdicts.prism.status).toBe('pass');
    // 300–900 nm needs ln 3 / 0.028622 = 38.4 → 39 tilted filters and 6 glasses (hand counts above).
    expect(row.verdicts['interference-filter'].status).toBe('fail');
    expect(row.verdicts['interference-filter'].message).toMatch(/39 cover the range/);
    expect(row.verdicts['coloured-glass'].message).toMatch(/6 span the range/);
  });

  it('focal length and f-number are not checked for filters, and say why', () => {
    const study = tradeStudy(withRequirements(makeDesign(), { maxFocalLengthMm: 500, maxFNumber: 10 }));
    for (const id of ['interference-filter', 'coloured-glass'] as const) {
      expect(verdict(study, 'maxFocalLengthMm', id)?.status).toBe('not-checked');
      expect(verdict(study, 'maxFNumber', id)?.status).toBe('not-checked');
      expect(verdict(study, 'maxFNumber', id)?.message.length).toBeGreaterThan(10);
    }
    expect(verdict(study, 'maxFocalLengthMm', 'prism')?.status).toBe('pass');
  });

  it('the prism’s f-number comes from the beam it passes: base 50 mm, 60° fused silica at 600 nm is f/8.77 at 300 mm', () => {
    // Born & Wolf, §4.7 geometry: face L = b / (2 sin 30°) = 50 mm; sin i = n sin 30° with n(600 nm)
    // = 1.45804 (Malitson 1965's formula, evaluated by hand) → sin i = 0.72902, cos i = 0.68449; beam
    // 50 × 0.68449 = 34.22 mm; f/# = 300 / 34.22 = 8.766 (slower than 300/50 = 6 along the slit).
    const study = tradeStudy(withRequirements(makeDesign(), { maxFNumber: 8 }));
    const prism = verdict(study, 'maxFNumber', 'prism')!;
    expect(prism.status).toBe('fail');
    expect(prism.message).toMatch(/f\/8\.77 across the prism/);
  });

  it('the footprint: the grating’s outline when given, each filter by its own diameter', () => {
    const requirements = { maxFootprintMm: { widthMm: 400, depthMm: 20 } };
    const without = tradeStudy(withRequirements(makeDesign(), requirements));
    expect(verdict(without, 'maxFootprintMm', 'grating')?.status).toBe('not-checked');
    const given = tradeStudy(withRequirements(makeDesign(), requirements), { gratingFootprintMm: { widthMm: 350, depthMm: 300 } });
    expect(verdict(given, 'maxFootprintMm', 'grating')?.status).toBe('fail');
    // 25 mm stock filters do not fit a 20 mm depth; 12 mm ones do.
    expect(verdict(given, 'maxFootprintMm', 'interference-filter')?.status).toBe('fail');
    const small = tradeStudy(withRequirements(makeDesign(), requirements), { interferenceFilter: { diameterMm: 12 } });
    expect(verdict(small, 'maxFootprintMm', 'interference-filter')?.status).toBe('pass');
  });

  it('the grating’s verdicts agree with the requirements check on the same design', () => {
    const requirements: Requirements = {
      maxBandpassNm: 0.27,
      minResolvingPower: 2500,
      maxFNumber: 7,
      maxFocalLengthMm: 250,
      orderOverlap: 'forbidden',
    };
    const cases: [{ startNm: number; endNm: number }, Requirements['orderOverlap']][] = [
      [{ startNm: 300, endNm: 900 }, 'forbidden'],
      [{ startNm: 450, endNm: 650 }, 'forbidden'],
      [{ startNm: 300, endNm: 900 }, 'filtered'],
    ];
    for (const [range, orderOverlap] of cases) {
      const design = withRequirements(makeDesign({ range, source: undefined }), { ...requirements, orderOverlap });
      const study = tradeStudy(design);
      const words = { pass: 'pass', fail: 'fail', unknown: 'not-checked' } as const;
      for (const check of checkRequirements(design).checks) {
        expect(verdict(study, check.id as TradeVerdictId, 'grating')?.status, `${check.id} over ${range.startNm}–${range.endNm}, overlaps ${orderOverlap}`).toBe(
          words[check.status],
        );
      }
    }
  });

  it('“filtered” overlaps: the grating fails without order-sorting filters and passes with the proposed plan', () => {
    // 300–900 nm lit only over the range: order 2 brings 300–450 nm onto 600–900 nm (Palmer & Loewen, ch. 2).
    const bare = withRequirements(makeDesign({ source: undefined }), { orderOverlap: 'filtered' });
    expect(verdict(tradeStudy(bare), 'orderOverlap', 'grating')?.status).toBe('fail');
    const plan = evaluateDesign(bare).orderSorting.proposedFilters;
    expect(plan.length).toBeGreaterThan(0);
    const filtered = tradeStudy({ ...bare, filters: plan });
    expect(verdict(filtered, 'orderOverlap', 'grating')?.status).toBe('pass');
    expect(selector(filtered, 'grating').overlappingOrders).toMatch(/block them all/);
  });

  it('requirements only a grating has are named apart, not given verdicts', () => {
    const study = tradeStudy(withRequirements(makeDesign(), { minBlazeEfficiency: 0.4, maxBandpassNm: 1 }));
    expect(study.gratingOnly).toEqual(['minBlazeEfficiency']);
    expect(study.verdicts.map((r) => r.id)).toEqual(['coverage', 'maxBandpassNm']);
    expect(study.verdictNote).toMatch(/grating alone/);
  });

  it('judges at the listed wavelengths when the requirements name them', () => {
    // The prism is about 1.8 nm wide at 380 nm and over 4.1 nm from 500 nm up (4.108 nm at 500 nm by
    // hand above; it grows toward the red): a 3 nm limit passes at 380 nm alone and fails over the range.
    const design = makeDesign({ range: { startNm: 380, endNm: 780 } });
    const listed = tradeStudy(withRequirements(design, { maxBandpassNm: 3, atWavelengthsNm: [380] }));
    expect(verdict(listed, 'maxBandpassNm', 'prism')?.status).toBe('pass');
    const whole = tradeStudy(withRequirements(design, { maxBandpassNm: 3 }));
    expect(verdict(whole, 'maxBandpassNm', 'prism')?.status).toBe('fail');
  });
});

describe('options', () => {
  it('overrides merge group by group onto the defaults', () => {
    const options = resolveTradeStudyOptions({ prism: { apexDeg: 45 } });
    expect(options.prism).toEqual({ ...DEFAULT_TRADE_STUDY_OPTIONS.prism, apexDeg: 45 });
    expect(options.interferenceFilter).toEqual(DEFAULT_TRADE_STUDY_OPTIONS.interferenceFilter);
  });

  it('a prism base of its own replaces the grating’s width', () => {
    const study = tradeStudy(makeDesign(), { prism: { baseMm: 100 } });
    expect(selector(study, 'prism').setup).toMatch(/100\u00A0mm base/);
  });

  it.each([
    [{ prism: { apexDeg: 0 } }, 'prism.apexDeg'],
    [{ prism: { apexDeg: 180 } }, 'prism.apexDeg'],
    [{ prism: { baseMm: -1 } }, 'prism.baseMm'],
    [{ interferenceFilter: { mirrorReflectance: 1 } }, 'interferenceFilter.mirrorReflectance'],
    [{ interferenceFilter: { order: 0.5 } }, 'interferenceFilter.order'],
    [{ colouredGlass: { widthNm: 0 } }, 'colouredGlass.widthNm'],
    [{ points: 1 }, 'points'],
  ] as const)('refuses %j, naming %s', (overrides, path) => {
    expect(tradeStudyOptionIssues(resolveTradeStudyOptions(overrides))).toHaveProperty([path]);
    expect(() => tradeStudy(makeDesign(), overrides)).toThrow(new RegExp(`^${path.replace('.', '\\.')}: `));
  });

  it('a prism apex too steep for any ray: no bandpass, a reason, and the verdicts fail rather than guess', () => {
    // n sin(A/2) ≥ 1: 1.46 · sin 45° = 1.03 at A = 90° (Hecht, §5.5: total internal reflection).
    const study = tradeStudy(withRequirements(makeDesign(), { maxBandpassNm: 10 }), { prism: { apexDeg: 90 } });
    const prism = selector(study, 'prism');
    expect(prism.bandpassNm.every((b) => b === null)).toBe(true);
    expect(prism.notes.join(' ')).toMatch(/No ray passes/);
    expect(verdict(study, 'coverage', 'prism')?.status).toBe('fail');
    expect(verdict(study, 'maxBandpassNm', 'prism')?.status).toBe('fail');
  });
});

describe('every number is finite', () => {
  const every: Requirements = {
    maxBandpassNm: 1,
    minResolvingPower: 1000,
    maxFNumber: 5,
    maxFocalLengthMm: 100,
    maxFootprintMm: { widthMm: 100, depthMm: 100 },
    orderOverlap: 'filtered',
  };
  const designs: [string, Design][] = [
    ['the example', makeDesign()],
    ['an X-ray range, 0.001–0.002 nm', makeDesign({ range: { startNm: 0.001, endNm: 0.002 }, source: undefined })],
    ['a far-infrared range, 1–10 mm', makeDesign({ grating: { grooveDensityPerMm: 0.1, blazeWavelengthNm: 5e6 }, range: { startNm: 1e6, endNm: 1e7 }, source: undefined })],
    ['an echelle in order 1000', makeDesign({ grating: { grooveDensityPerMm: 10, order: 1000 }, range: { startNm: 500, endNm: 501 } })],
    ['a Littrow mount', makeDesign({ layout: { kind: 'littrow', deviationAngleDeg: 0 } })],
  ];

  function walk(value: unknown, path: string, out: string[]): void {
    if (typeof value === 'number' && !Number.isFinite(value)) out.push(`${path} = ${value}`);
    else if (Array.isArray(value)) value.forEach((v, i) => walk(v, `${path}[${i}]`, out));
    else if (value && typeof value === 'object') for (const [k, v] of Object.entries(value)) walk(v, `${path}.${k}`, out);
    else if (typeof value === 'string' && /NaN|Infinity|undefined/.test(value)) out.push(`${path}: "${value}"`);
  }

  it.each(designs)('%s', (_name, design) => {
    const bad: string[] = [];
    walk(tradeStudy(withRequirements(design, every), { gratingFootprintMm: { widthMm: 50, depthMm: 50 } }), 'study', bad);
    expect(bad).toEqual([]);
  });
});
