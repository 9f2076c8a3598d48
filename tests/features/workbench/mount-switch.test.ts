import { describe, expect, it } from 'vitest';
import {
  DEFAULT_DEVIATION_DEG,
  rememberDeviation,
  switchDeviation,
  type DeviationMemory,
} from '../../../features/workbench/mount-switch';
import { demoDesigns } from '../../../shared/demo-designs';
import { designSchema, exampleDesign } from '../../../shared/design';

describe('the deviation angle when the mount changes', () => {
  it('gives a two-mirror mount its default, never the 0 a Littrow leaves behind', () => {
    const { deviationText } = switchDeviation({}, 'littrow', '0', 'czerny-turner');
    expect(deviationText).toBe(String(DEFAULT_DEVIATION_DEG['czerny-turner']));
    expect(Number(deviationText)).toBeGreaterThan(0);
  });

  it('uses a default inside the span of our own two-mirror demo designs (common practice: 20–30°)', () => {
    const deviations = Object.values(demoDesigns)
      .filter((d) => (d.layout.kind as string) !== 'littrow')
      .map((d) => d.layout.deviationAngleDeg);
    for (const kind of ['czerny-turner', 'ebert-fastie'] as const) {
      expect(DEFAULT_DEVIATION_DEG[kind]).toBeGreaterThanOrEqual(Math.min(20, ...deviations));
      expect(DEFAULT_DEVIATION_DEG[kind]).toBeLessThanOrEqual(Math.max(30, ...deviations));
    }
    // And a design switched to it is one the schema accepts.
    const switched = { ...exampleDesign, layout: { ...exampleDesign.layout, deviationAngleDeg: DEFAULT_DEVIATION_DEG['czerny-turner'] } };
    expect(designSchema.safeParse(switched).success).toBe(true);
  });

  it('sets 0 for Littrow and brings back the angle typed for the mount left', () => {
    const toLittrow = switchDeviation({}, 'czerny-turner', '31.5', 'littrow');
    expect(toLittrow.deviationText).toBe('0');
    const back = switchDeviation(toLittrow.memory, 'littrow', '0', 'czerny-turner');
    expect(back.deviationText).toBe('31.5');
  });

  it('remembers each mount on its own', () => {
    let memory: DeviationMemory = {};
    ({ memory } = switchDeviation(memory, 'czerny-turner', '30', 'ebert-fastie'));
    // Ebert–Fastie has had nothing typed yet: its own default, not the Czerny–Turner's 30.
    const toEbert = switchDeviation(memory, 'czerny-turner', '30', 'ebert-fastie');
    expect(toEbert.deviationText).toBe(String(DEFAULT_DEVIATION_DEG['ebert-fastie']));
    ({ memory } = switchDeviation(memory, 'ebert-fastie', '18', 'czerny-turner'));
    expect(switchDeviation(memory, 'czerny-turner', '30', 'ebert-fastie').deviationText).toBe('18');
    expect(switchDeviation(memory, 'ebert-fastie', '18', 'czerny-turner').deviationText).toBe('30');
  });

  it('does not remember a degenerate 0, or text that does not read, for a two-mirror mount', () => {
    expect(rememberDeviation({}, 'czerny-turner', '0')).toEqual({});
    expect(rememberDeviation({}, 'czerny-turner', 'abc')).toEqual({});
    expect(rememberDeviation({}, 'czerny-turner', '200')).toEqual({});
    expect(rememberDeviation({}, 'czerny-turner', ' 26 ')).toEqual({ 'czerny-turner': '26' });
  });
});
