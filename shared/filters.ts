import { z } from 'zod';
import { number, section } from './schema-words';

/**
 * Order-sorting filters: the optional `filters` list of a design. Each is a filter in the beam
 * while the instrument is set between `inFromNm` and `inToNm`. Field names carry their units and
 * are part of the scripting interface and the notebook file.
 *
 * A long-pass edge is modelled as a straight ramp `edgeWidthNm` wide centred on `cutOnNm` (the
 * 50 % point, as cut-on wavelengths are usually quoted; common practice): it blocks at and below
 * `cutOnNm − edgeWidthNm / 2` and passes fully at and above `cutOnNm + edgeWidthNm / 2`
 * (features/solver/order-sorting.ts).
 */

/** Most filters one design may carry: a plan over decades of wavelength needs a handful. */
export const MAX_DESIGN_FILTERS = 12;

export const FILTER_KINDS = ['long-pass'] as const;
export type FilterKind = (typeof FILTER_KINDS)[number];

const wavelength = () =>
  number()
    .gt(0, { error: 'must be greater than 0' })
    .min(0.001, { error: 'must be at least 0.001 nm' })
    .max(10_000_000, { error: 'must be at most 10000000 nm' });

export const orderSortingFilterSchema = section({
  kind: z.enum(FILTER_KINDS, {
    error: (issue) => (issue.input === undefined ? 'is required' : 'must be long-pass'),
  }),
  /** Where the edge passes half the light, nm. */
  cutOnNm: wavelength(),
  /** The filter is in the beam while the instrument is set from here… */
  inFromNm: wavelength(),
  /** …to here, nm. */
  inToNm: wavelength(),
  /** Width of the edge from blocking to full transmission, nm. */
  edgeWidthNm: number()
    .min(0, { error: 'must be at least 0 nm' })
    .max(1_000_000, { error: 'must be at most 1000000 nm' }),
}).superRefine((filter, ctx) => {
  if (
    typeof filter.inFromNm === 'number' &&
    typeof filter.inToNm === 'number' &&
    !(filter.inToNm > filter.inFromNm)
  ) {
    ctx.addIssue({ code: 'custom', path: ['inToNm'], message: 'must be greater than inFromNm' });
  }
});

export type OrderSortingFilter = z.infer<typeof orderSortingFilterSchema>;

export const filtersSchema = z
  .array(orderSortingFilterSchema, { error: 'must be a list of filters' })
  .max(MAX_DESIGN_FILTERS, { error: `must list at most ${MAX_DESIGN_FILTERS} filters` });
