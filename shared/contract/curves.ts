import {
  curveFileFieldsSchema,
  curvePreviewResponseSchema,
  curveUploadFieldsSchema,
  teamCurveListResponseSchema,
  teamCurveParamsSchema,
  teamCurveResponseSchema,
  teamCurveUploadResponseSchema,
} from '../team-curves';
import { teamParamsSchema } from '../teams';
import { route } from './route';

const tag = 'Curves';

/**
 * Measured curves: a file is read (`POST /curves/preview`, nothing stored) and kept in the team's
 * library, from which a design copies the points it needs. The two uploads are multipart/form-data
 * with the file in the part `file` (at most MAX_CURVE_FILE_BYTES, else 413).
 */
export const curves = {
  preview: route({
    tag,
    method: 'POST',
    path: '/curves/preview',
    summary: 'Read a curve file and answer what was detected and the points; stores nothing',
    access: { kind: 'signed-in' },
    upload: { field: 'file' },
    body: curveFileFieldsSchema,
    output: curvePreviewResponseSchema,
  }),
  upload: route({
    tag,
    method: 'POST',
    path: '/teams/{teamId}/curves',
    summary: "Add a curve file to the team's library (200 with recognised: true when the same file, read the same way, is already there)",
    status: 201,
    access: { kind: 'team', capability: 'curves.manage' },
    upload: { field: 'file', sameAnswerStatus: 200 },
    params: teamParamsSchema,
    body: curveUploadFieldsSchema,
    output: teamCurveUploadResponseSchema,
  }),
  list: route({
    tag,
    method: 'GET',
    path: '/teams/{teamId}/curves',
    summary: "The team's curves, newest first, without their points",
    access: { kind: 'team', capability: 'curves.read' },
    params: teamParamsSchema,
    output: teamCurveListResponseSchema,
  }),
  get: route({
    tag,
    method: 'GET',
    path: '/teams/{teamId}/curves/{curveId}',
    summary: 'One curve with its points, in the shape a design carries',
    access: { kind: 'team', capability: 'curves.read' },
    params: teamCurveParamsSchema,
    output: teamCurveResponseSchema,
  }),
  remove: route({
    tag,
    method: 'DELETE',
    path: '/teams/{teamId}/curves/{curveId}',
    summary: "Remove a curve from the library (designs keep their copies)",
    status: 204,
    access: { kind: 'team', capability: 'curves.manage' },
    params: teamCurveParamsSchema,
  }),
};
