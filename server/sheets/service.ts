import type { User } from '../../shared/auth';
import { storedDesignSchema, type Design } from '../../shared/design';
import type { Notebook } from '../../shared/notebooks/index';
import { compareSheetFileName, sheetFileName, type CompareSheetQuery, type SheetQuery } from '../../shared/sheets';
import { evaluateDesign } from '../../features/solver/index';
import type { Clock } from '../clock';
import type { NotebooksService } from '../notebooks/index';
import type { ReviewsService } from '../reviews/index';
import { buildCompareSheet, buildSheet } from './build';
import { sheetContext } from './context';
import type { SheetsRepository } from './repository';

export type SheetFile = { bytes: Buffer; fileName: string };

export type SheetsServiceDeps = {
  notebooks: Pick<NotebooksService, 'versionWithDesign' | 'openShare' | 'compare'>;
  reviews: Pick<ReviewsService, 'reviewOf'>;
  repository: SheetsRepository;
  clock: Clock;
  publicUrl: () => string;
};

/** Stored parameters in the schema's order (jsonb keeps its own key order). */
const designOf = (params: unknown): Design => storedDesignSchema.parse(params) as Design;

/** What the title block says of a design a member reads. */
function titleBlock(design: Notebook, teamName: string | null) {
  const { id, title, clonedFrom, importedAt } = design;
  return { id, title, teamName, clonedFrom, importedAt };
}

/**
 * Gathers a version (access checked by the notebooks module, exactly as for reading it on screen),
 * its review and the solver's results, and builds the PDF in memory.
 */
export function createSheetsService({ notebooks, reviews, repository, clock, publicUrl }: SheetsServiceDeps) {
  return {
    async version(user: User, designId: string, n: number, query: SheetQuery): Promise<SheetFile> {
      const { design, version } = await notebooks.versionWithDesign(user, designId, n);
      const [review, teamName] = await Promise.all([reviews.reviewOf(designId, n), repository.teamName(design.teamId)]);
      const sheet = sheetContext({
        paper: query.paper,
        audience: 'team',
        design: { ...titleBlock(design, teamName), isBaseline: design.baselineVersion === n },
        version,
        params: designOf(version.params),
        review,
        generatedAt: clock.now(),
        link: `${publicUrl()}/notebooks/${encodeURIComponent(design.id)}/v/${n}`,
        picked: query.at,
      });
      return { bytes: await buildSheet(sheet), fileName: sheetFileName(design.title, n) };
    },

    async shared(token: string, query: SheetQuery): Promise<SheetFile> {
      const { designId, title, version } = await notebooks.openShare(token);
      const review = await reviews.reviewOf(designId, version.number);
      const sheet = sheetContext({
        paper: query.paper,
        audience: 'link',
        design: { id: designId, title, teamName: null, clonedFrom: null, importedAt: null, isBaseline: null },
        version,
        params: designOf(version.params),
        review,
        generatedAt: clock.now(),
        link: `${publicUrl()}/share/${encodeURIComponent(token)}`,
        picked: query.at,
      });
      return { bytes: await buildSheet(sheet), fileName: sheetFileName(title, version.number) };
    },

    async compare(user: User, designId: string, query: CompareSheetQuery): Promise<SheetFile> {
      const { a, b, changes, figures } = await notebooks.compare(user, designId, query.a, query.b);
      const { design } = await notebooks.versionWithDesign(user, designId, b.number);
      const teamName = await repository.teamName(design.teamId);
      const side = (version: typeof a) => {
        const params = designOf(version.params);
        return { version, params, evaluation: evaluateDesign(params) };
      };
      const bytes = await buildCompareSheet({
        paper: query.paper,
        design: { ...titleBlock(design, teamName), isBaseline: null },
        a: side(a),
        b: side(b),
        changes,
        figures,
        generatedAt: clock.now(),
        link: `${publicUrl()}/notebooks/${encodeURIComponent(design.id)}/compare?a=${a.number}&b=${b.number}`,
      });
      return { bytes, fileName: compareSheetFileName(design.title, a.number, b.number) };
    },
  };
}
export type SheetsService = ReturnType<typeof createSheetsService>;
