import { Router } from 'express';
import {
  baselineRequestSchema,
  cloneRequestSchema,
  compareQuerySchema,
  createDesignRequestSchema,
  createShareLinkRequestSchema,
  designParamsSchema,
  importRequestSchema,
  listDesignsQuerySchema,
  saveVersionRequestSchema,
  shareLinkParamsSchema,
  shareTokenParamsSchema,
  teamDesignsParamsSchema,
  updateDesignRequestSchema,
  versionParamsSchema,
} from '../../shared/notebooks';
import { requireUser, signedIn } from '../auth/index';
import { handle } from '../http/validate';
import type { NotebooksService } from './service';

/** A file name for the export: the title in plain letters, never a path. */
function fileName(title: string): string {
  const base = title
    .normalize('NFKD')
    .replace(/[^\w -]+/g, '')
    .trim()
    .replace(/\s+/g, '-')
    .toLowerCase()
    .slice(0, 60);
  return `${base || 'notebook'}.blazebook.json`;
}

/** Design notebooks. Roles are checked in the service; this only translates HTTP. */
export function notebooksRouter(notebooks: NotebooksService) {
  const router = Router();

  router.get(
    '/teams/:teamId/designs',
    signedIn,
    handle(
      { params: teamDesignsParamsSchema, query: listDesignsQuerySchema },
      async ({ params, query }, _req, res) => notebooks.list(requireUser(res), params.teamId, query),
    ),
  );
  router.post(
    '/teams/:teamId/designs',
    signedIn,
    handle(
      { params: teamDesignsParamsSchema, body: createDesignRequestSchema },
      async ({ params, body }, _req, res) => {
        const created = await notebooks.create(requireUser(res), params.teamId, body);
        res.status(201);
        return created;
      },
    ),
  );
  router.post(
    '/teams/:teamId/designs/import',
    signedIn,
    handle(
      { params: teamDesignsParamsSchema, body: importRequestSchema },
      async ({ params, body }, _req, res) => {
        const imported = await notebooks.importFile(requireUser(res), params.teamId, body);
        res.status(201);
        return imported;
      },
    ),
  );

  router.get(
    '/designs/:id',
    signedIn,
    handle({ params: designParamsSchema }, async ({ params }, _req, res) =>
      notebooks.get(requireUser(res), params.id),
    ),
  );
  router.patch(
    '/designs/:id',
    signedIn,
    handle(
      { params: designParamsSchema, body: updateDesignRequestSchema },
      async ({ params, body }, _req, res) => ({
        design: await notebooks.update(requireUser(res), params.id, body),
      }),
    ),
  );

  router.get(
    '/designs/:id/versions',
    signedIn,
    handle({ params: designParamsSchema }, async ({ params }, _req, res) => ({
      versions: await notebooks.versions(requireUser(res), params.id),
    })),
  );
  router.post(
    '/designs/:id/versions',
    signedIn,
    handle(
      { params: designParamsSchema, body: saveVersionRequestSchema },
      async ({ params, body }, _req, res) => {
        const saved = await notebooks.save(requireUser(res), params.id, body);
        res.status(201);
        return saved;
      },
    ),
  );
  router.get(
    '/designs/:id/versions/:n',
    signedIn,
    handle({ params: versionParamsSchema }, async ({ params }, _req, res) =>
      notebooks.version(requireUser(res), params.id, params.n),
    ),
  );

  router.get(
    '/designs/:id/compare',
    signedIn,
    handle({ params: designParamsSchema, query: compareQuerySchema }, async ({ params, query }, _req, res) =>
      notebooks.compare(requireUser(res), params.id, query.a, query.b),
    ),
  );
  router.post(
    '/designs/:id/clone',
    signedIn,
    handle({ params: designParamsSchema, body: cloneRequestSchema }, async ({ params, body }, _req, res) => {
      const cloned = await notebooks.clone(requireUser(res), params.id, body);
      res.status(201);
      return cloned;
    }),
  );
  router.put(
    '/designs/:id/baseline',
    signedIn,
    handle(
      { params: designParamsSchema, body: baselineRequestSchema },
      async ({ params, body }, _req, res) => ({
        design: await notebooks.setBaseline(requireUser(res), params.id, body.version),
      }),
    ),
  );

  router.get(
    '/designs/:id/share-links',
    signedIn,
    handle({ params: designParamsSchema }, async ({ params }, _req, res) => ({
      links: await notebooks.shareLinks(requireUser(res), params.id),
    })),
  );
  router.post(
    '/designs/:id/share-links',
    signedIn,
    handle(
      { params: designParamsSchema, body: createShareLinkRequestSchema },
      async ({ params, body }, _req, res) => {
        const created = await notebooks.createShareLink(requireUser(res), params.id, body);
        res.status(201);
        return created;
      },
    ),
  );
  router.delete(
    '/designs/:id/share-links/:linkId',
    signedIn,
    handle({ params: shareLinkParamsSchema }, async ({ params }, _req, res) => {
      await notebooks.revokeShareLink(requireUser(res), params.id, params.linkId);
      res.status(204).end();
    }),
  );

  router.get(
    '/designs/:id/export',
    signedIn,
    handle({ params: designParamsSchema }, async ({ params }, _req, res) => {
      const file = await notebooks.exportFile(requireUser(res), params.id);
      res.attachment(fileName(file.title));
      return file;
    }),
  );

  // The link's token is the credential: no session needed, and it opens one version only.
  router.get(
    '/share/:token',
    handle({ params: shareTokenParamsSchema }, async ({ params }, _req, res) => {
      res.set('referrer-policy', 'no-referrer');
      return notebooks.shared(params.token);
    }),
  );

  return router;
}
