import type { apiContract } from '../../shared/contract/index';
import { requireUser } from '../auth/index';
import type { GroupImplementation } from '../http/contract';
import type { ReviewsService } from './service';

/** Design review (`apiContract.reviews`). Roles are checked in the service; this only translates HTTP. */
export function reviewsRouter(reviews: ReviewsService): GroupImplementation<typeof apiContract.reviews> {
  return {
    get: ({ params }, _req, res) => reviews.get(requireUser(res), params.id, params.n),
    states: async ({ params }, _req, res) => ({ versions: await reviews.states(requireUser(res), params.id) }),
    startThread: async ({ params, body }, _req, res) => ({
      thread: await reviews.startThread(requireUser(res), params.id, params.n, body),
    }),
    getThread: async ({ params }, _req, res) => ({ thread: await reviews.getThread(requireUser(res), params.threadId) }),
    reply: async ({ params, body }, _req, res) => ({ thread: await reviews.reply(requireUser(res), params.threadId, body) }),
    setThreadStatus: async ({ params, body }, _req, res) => ({
      thread: await reviews.setThreadStatus(requireUser(res), params.threadId, body.status),
    }),
    editRemark: async ({ params, body }, _req, res) => ({
      thread: await reviews.editRemark(requireUser(res), params.remarkId, body),
    }),
    removeRemark: async ({ params }, _req, res) => ({ thread: await reviews.removeRemark(requireUser(res), params.remarkId) }),
    requestReview: async ({ params, body }, _req, res) => ({
      requests: await reviews.requestReview(requireUser(res), params.id, params.n, body),
    }),
    decide: async ({ params, body }, _req, res) => ({
      decision: await reviews.decide(requireUser(res), params.id, params.n, body),
    }),
  };
}
