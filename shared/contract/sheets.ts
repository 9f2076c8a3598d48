import { designParamsSchema, shareTokenParamsSchema, versionParamsSchema } from '../notebooks';
import { compareSheetQuerySchema, sheetQuerySchema } from '../sheets';
import { route } from './route';

const tag = 'Design sheets';
const pdf = { mediaType: 'application/pdf' } as const;
const description =
  'Built whole in memory before it is sent. The three sheet routes share one allowance of 60 sheets a minute per address, then 429 `rate_limited`.';

/**
 * Design sheets: PDFs built in memory on the server and sent whole (a failure answers the JSON
 * error shape, never half a file). Members read them; a share link's holder reads its version's.
 */
export const sheets = {
  version: route({
    tag,
    method: 'GET',
    path: '/designs/{id}/versions/{n}/sheet.pdf',
    summary: 'The design sheet of one version as a PDF (A4 or US Letter; `at` adds wavelengths to the performance table)',
    access: { kind: 'team', capability: 'designs.read' },
    params: versionParamsSchema,
    query: sheetQuerySchema,
    file: pdf,
    description,
  }),
  compare: route({
    tag,
    method: 'GET',
    path: '/designs/{id}/compare.pdf',
    summary: 'Versions a and b side by side as a PDF: parameters with changes marked, both sketches at one scale, figure changes',
    access: { kind: 'team', capability: 'designs.read' },
    params: designParamsSchema,
    query: compareSheetQuerySchema,
    file: pdf,
    description,
  }),
  shared: route({
    tag,
    method: 'GET',
    path: '/share/{token}/sheet.pdf',
    summary: "The design sheet of the one version a read-only link opens (review threads' text stays with the team)",
    access: { kind: 'link' },
    params: shareTokenParamsSchema,
    query: sheetQuerySchema,
    file: pdf,
    description,
  }),
};
