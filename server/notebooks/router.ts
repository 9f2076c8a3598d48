import type { apiContract } from '../../shared/contract/index';
import { exportFileName } from '../../shared/export-file-name';
import { requireUser } from '../auth/index';
import type { GroupImplementation } from '../http/contract';
import type { NotebooksService } from './service';

/**
 * Design notebooks (`apiContract.notebooks`). Roles are checked in the service; this only
 * translates HTTP.
 */
export function notebooksRouter(notebooks: NotebooksService): GroupImplementation<typeof apiContract.notebooks> {
  return {
    list: ({ params, query }, _req, res) => notebooks.list(requireUser(res), params.teamId, query),
    create: ({ params, body }, _req, res) => notebooks.create(requireUser(res), params.teamId, body),
    importFile: ({ params, body }, _req, res) => notebooks.importFile(requireUser(res), params.teamId, body),
    get: ({ params }, _req, res) => notebooks.get(requireUser(res), params.id),
    update: async ({ params, body }, _req, res) => ({ design: await notebooks.update(requireUser(res), params.id, body) }),
    versions: async ({ params }, _req, res) => ({ versions: await notebooks.versions(requireUser(res), params.id) }),
    saveVersion: ({ params, body }, _req, res) => notebooks.save(requireUser(res), params.id, body),
    version: ({ params }, _req, res) => notebooks.version(requireUser(res), params.id, params.n),
    compare: ({ params, query }, _req, res) => notebooks.compare(requireUser(res), params.id, query.a, query.b),
    clone: ({ params, body }, _req, res) => notebooks.clone(requireUser(res), params.id, body),
    setBaseline: async ({ params, body }, _req, res) => ({ design: await notebooks.setBaseline(requireUser(res), params.id, body.version) }),
    shareLinks: async ({ params }, _req, res) => ({ links: await notebooks.shareLinks(requireUser(res), params.id) }),
    createShareLink: ({ params, body }, _req, res) => notebooks.createShareLink(requireUser(res), params.id, body),
    revokeShareLink: async ({ params }, _req, res) => {
      await notebooks.revokeShareLink(requireUser(res), params.id, params.linkId);
    },
    exportFile: async ({ params }, _req, res) => {
      const file = await notebooks.exportFile(requireUser(res), params.id);
      res.attachment(exportFileName(file.title));
      return file;
    },
    // The link's token is the credential: no session needed, and it opens one version only.
    shared: ({ params }, _req, res) => {
      res.set('referrer-policy', 'no-referrer');
      return notebooks.shared(params.token);
    },
  };
}
