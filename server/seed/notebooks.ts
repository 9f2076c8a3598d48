import { randomUUID } from 'node:crypto';
import type { DatabaseHandle } from '../../db/client';
import { demoDesigns } from '../../shared/demo-designs';
import { exampleDesign, type Design } from '../../shared/design';
import { createNotebooksRepository, type VersionInsert } from '../notebooks/repository';
import { summarizeVersion } from '../notebooks/summary';

const dayMs = 24 * 60 * 60_000;

type DemoVersion = { message: string; notes: string; design: Design };
type DemoNotebook = {
  title: string;
  tags: string[];
  baselineVersion: number | null;
  versions: DemoVersion[];
};

/** Invented instruments and invented reasoning: round numbers a lab would start from. */
const scanner = (slitsUm: number, extra: Partial<Design> = {}): Design => ({
  ...exampleDesign,
  slits: { entranceWidthUm: slitsUm, exitWidthUm: slitsUm, heightMm: 10 },
  ...extra,
});

export const demoNotebooks: readonly DemoNotebook[] = [
  {
    title: 'Teaching-lab visible scanner',
    tags: ['teaching', 'visible'],
    baselineVersion: 2,
    versions: [
      {
        message: 'First layout around the spare 1200/mm grating',
        notes:
          '# Starting point\n\nA 0.3 m Czerny–Turner around the 50 mm grating in the store cupboard, ' +
          'blazed at 500 nm. Slits at 100 µm to begin with: bright enough for students to align by eye.',
        design: scanner(100),
      },
      {
        message: 'Halve the slits for the line-lamp exercise',
        notes:
          '## Why 50 µm\n\nThe discharge-lamp exercise needs neighbouring lines apart. Halving both slits ' +
          'halves the bandpass at the same dispersion; the lamp is bright enough to afford it.\n\n' +
          '- students start from **this** version\n- keep the detector for the camera-port variant',
        design: scanner(50),
      },
      {
        message: 'Try a 600/mm grating for a wider range on the array',
        notes:
          'Exploratory. More of the spectrum on the array, at the price of bandpass. ' +
          'Not the baseline: compare it with v2 before deciding.',
        design: scanner(50, {
          grating: { ...exampleDesign.grating, grooveDensityPerMm: 600, blazeWavelengthNm: 750 },
        }),
      },
    ],
  },
  {
    title: 'UV excitation arm',
    tags: ['uv', 'fluorescence'],
    baselineVersion: null,
    versions: [
      {
        message: 'Short-focus arm for the xenon lamp',
        notes:
          '# Excitation side\n\n0.25 m, 2400/mm blazed at 250 nm. Throughput matters more than resolution ' +
          'here, so the slits are wide.',
        design: demoDesigns.uvExcitation,
      },
      {
        message: 'Narrow the exit slit to 300 µm',
        notes: 'The sample holder only takes a 3 mm spot; a narrower exit costs little light on it.',
        design: {
          ...demoDesigns.uvExcitation,
          slits: { ...demoDesigns.uvExcitation.slits, exitWidthUm: 300 },
        },
      },
    ],
  },
];

/**
 * Writes the demo notebooks into the demo team, each in one transaction, versions a few days
 * apart before `now` and written by the team's owner. Answers what it wrote, in order.
 */
export async function seedDemoNotebooks(
  database: DatabaseHandle,
  teamId: string,
  ownerId: string,
  now: Date,
) {
  const repository = createNotebooksRepository(database.db);
  const written: { id: string; title: string; versions: { params: unknown; createdAt: Date }[] }[] = [];
  for (const [index, notebook] of demoNotebooks.entries()) {
    const id = randomUUID();
    const count = notebook.versions.length;
    const at = (n: number) => new Date(now.getTime() - ((count - n) * 3 + index) * dayMs);
    const versions: VersionInsert[] = notebook.versions.map((version, i) => ({
      id: randomUUID(),
      designId: id,
      number: i + 1,
      params: version.design,
      notes: version.notes,
      message: version.message,
      authorId: ownerId,
      parentNumber: i === 0 ? null : i,
      summary: summarizeVersion(version.design),
      createdAt: at(i + 1),
    }));
    await repository.inTransaction((repo) =>
      repo.insertDesign(
        {
          id,
          teamId,
          title: notebook.title,
          tags: notebook.tags,
          createdBy: ownerId,
          latestVersion: count,
          baselineVersion: notebook.baselineVersion,
          createdAt: at(1),
          updatedAt: at(count),
        },
        versions,
      ),
    );
    written.push({ id, title: notebook.title, versions: versions.map((v) => ({ params: v.params, createdAt: v.createdAt! })) });
  }
  return written;
}
