import { exampleDesign, type Design } from '../../../shared/design';
import type { Version } from '../../../shared/notebooks';
import type { VersionReview } from '../../../shared/reviews';
import { summarizeVersion } from '../../../server/notebooks/index';
import { sheetContext, type CompareSheetContext, type SheetContext } from '../../../server/sheets/context';
import { evaluateDesign } from '../../../features/solver/index';
import { changedParameters, figureChanges } from '../../../server/notebooks/compare';

/**
 * Sheets built from plain values (no database): the design sheet's sections are functions of
 * their context, so these exercise every section in milliseconds. Demo data of our own (an
 * invented teaching lab), not real people.
 */

const person = (id: string, displayName: string) => ({ id, displayName });
export const author = person('u_author', 'Mira Okafor');
export const reviewer = person('u_reviewer', 'Tomas Lindqvist');

export function sampleVersion(params: Design = exampleDesign, number = 3, notes = sampleNotes): Version {
  return {
    number,
    message: 'Narrower exit slit for the sodium doublet',
    author,
    createdAt: '2026-11-28T09:30:00.000Z',
    parentNumber: number > 1 ? number - 1 : null,
    summary: summarizeVersion(params),
    params,
    notes,
  };
}

export const sampleNotes = [
  '# Why this version',
  'The exit slit went from **100 µm** to 60 µm so the sodium D lines (589.0 and 589.6 nm) separate.',
  '',
  '- Grating: 1200 g/mm, blazed at 500 nm',
  '- Check the [grating equation](https://en.wikipedia.org/wiki/Diffraction_grating) numbers at 300 nm',
  '',
  '> Ask the shop about the slit jaws.',
].join('\n');

export function sampleReview(version = 3): VersionReview {
  const at = '2026-11-29T14:00:00.000Z';
  return {
    version,
    authorId: author.id,
    state: 'signed-off-with-remarks',
    threads: [
      {
        id: 'th_1',
        designId: 'nb_sample',
        version,
        pin: { kind: 'field', path: 'slits.exitWidthUm' },
        pinnedValue: 60,
        status: 'open',
        resolvedBy: null,
        resolvedAt: null,
        statusEvents: [],
        remarks: [
          {
            id: 'rm_1',
            author: reviewer,
            authorName: reviewer.displayName,
            body: 'Is **60 µm** at the exit the value we agreed on? The requirement says 0.2 nm.',
            mentions: [],
            createdAt: at,
            editedAt: null,
            earlierBodies: [],
            removedAt: null,
          },
        ],
        carry: { state: 'here' },
      },
      {
        id: 'th_2',
        designId: 'nb_sample',
        version: version - 1,
        pin: { kind: 'result', result: 'bandpass', wavelengthNm: 589 },
        status: 'open',
        resolvedBy: null,
        resolvedAt: null,
        statusEvents: [],
        remarks: [
          {
            id: 'rm_2',
            author: author,
            authorName: author.displayName,
            body: 'Bandpass at 589 nm needs a second look once the slit is cut.',
            mentions: [],
            createdAt: at,
            editedAt: null,
            earlierBodies: [],
            removedAt: null,
          },
        ],
        carry: { state: 'still-applies', since: version - 1 },
      },
    ],
    requests: [
      {
        id: 'rq_1',
        version,
        requestedBy: author,
        reviewer,
        dueDate: '2026-12-04',
        note: 'Before the shop order',
        createdAt: at,
        answeredAt: '2026-11-30T10:00:00.000Z',
      },
    ],
    decisions: [
      {
        id: 'dc_1',
        version,
        reviewer,
        reviewerName: reviewer.displayName,
        outcome: 'signed-off-with-remarks',
        summary: 'Fine to build once the exit slit question is settled.',
        createdAt: '2026-11-30T10:00:00.000Z',
      },
    ],
    earlierSignOff: null,
  };
}

export const sampleGeneratedAt = new Date('2026-12-02T12:00:00.000Z');

export function sampleSheet(overrides: Partial<Parameters<typeof sheetContext>[0]> = {}): SheetContext {
  const params = overrides.params ?? exampleDesign;
  const version = overrides.version ?? sampleVersion(params);
  return sheetContext({
    paper: 'a4',
    audience: 'team',
    design: {
      id: 'nb_sample',
      title: 'Teaching bench monochromator',
      teamName: 'Harbourview teaching lab',
      clonedFrom: { designId: 'nb_base', title: 'Lab baseline', version: 2 },
      importedAt: null,
      isBaseline: false,
    },
    version,
    params,
    review: sampleReview(version.number),
    generatedAt: sampleGeneratedAt,
    link: 'http://localhost:8080/notebooks/nb_sample/v/3',
    picked: [589],
    ...overrides,
  });
}

export function sampleCompareSheet(before: Design = exampleDesign, after?: Design): CompareSheetContext {
  const b = after ?? { ...structuredClone(before), slits: { ...before.slits, exitWidthUm: 60 } };
  const va = sampleVersion(before, 2);
  const vb = sampleVersion(b, 3);
  return {
    paper: 'a4',
    design: {
      id: 'nb_sample',
      title: 'Teaching bench monochromator',
      teamName: 'Harbourview teaching lab',
      clonedFrom: null,
      importedAt: null,
      isBaseline: null,
    },
    a: { version: va, params: before, evaluation: evaluateDesign(before) },
    b: { version: vb, params: b, evaluation: evaluateDesign(b) },
    changes: changedParameters(before, b),
    figures: figureChanges(va.summary, vb.summary),
    generatedAt: sampleGeneratedAt,
    link: 'http://localhost:8080/notebooks/nb_sample/compare?a=2&b=3',
  };
}
