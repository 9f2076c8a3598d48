import { OpenAPIGenerator } from '@orpc/openapi';
import { ZodToJsonSchemaConverter } from '@orpc/zod/zod4';
import { errorBodySchema } from '../shared/api-error';
import { apiContract, apiRoutes, type Access, type apiContract as Contract } from '../shared/contract/index';
import { sessionCookieName } from './auth/lucia';
import type { Implementation } from './http/contract';

type Document = Awaited<ReturnType<OpenAPIGenerator['generate']>>;
type MediaType = { schema?: { properties?: Record<string, unknown> } };
type Operation = { responses?: Record<string, unknown>; security?: unknown[]; description?: string; requestBody?: { content?: Record<string, MediaType> } };

const sessionScheme = 'session';

const accessWords: Record<Access['kind'], string> = {
  anyone: 'Anyone may call this.',
  'signed-in': 'Needs a signed-in session (401 without).',
  team: '',
  link: 'The token in the path is the credential; no session needed.',
  local: 'Development servers only, and only over loopback (403 `outbox_local_only` otherwise).',
};

function accessText(access: Access): string {
  if (access.kind !== 'team') return accessWords[access.kind];
  return `Needs a session and, in the route's team, a role with \`${access.capability}\`: 404 for anyone outside the team (as for one that does not exist), 403 for a member without it.`;
}

/**
 * The OpenAPI 3.1 document of the whole API, generated from the contract (oRPC's generator with
 * its zod 4 converter). Added here, from the same contract: the `/api` server, the error shape on
 * every 4XX/5XX, the session cookie, and who may call each route.
 */
export async function buildOpenApiDocument(version: string): Promise<Document> {
  const generator = new OpenAPIGenerator({ schemaConverters: [new ZodToJsonSchemaConverter()] });
  const document = await generator.generate(apiContract, {
    info: {
      title: 'Blazebook API',
      version,
      description:
        'Design notebooks and the grating-monochromator solver. Every error answers `{ error: { code, message, fields?, details? } }`; ' +
        '`fields` maps a field path to why it was refused. State-changing calls from a browser must carry a same-site Origin. ' +
        'While the database is unavailable (a PostgreSQL server restarting), any route may answer 503 `database_unavailable` with Retry-After.',
    },
    servers: [{ url: '/api' }],
    components: { securitySchemes: { [sessionScheme]: { type: 'apiKey', in: 'cookie', name: sessionCookieName } } },
  });
  const [, errorSchema] = new ZodToJsonSchemaConverter().convert(errorBodySchema, { strategy: 'output' });
  document.components = { ...document.components, schemas: { ...document.components?.schemas, ErrorBody: errorSchema as unknown as Record<string, unknown> } };
  const errorResponse = (description: string) => ({ description, content: { 'application/json': { schema: { $ref: '#/components/schemas/ErrorBody' } } } });
  for (const entry of apiRoutes) {
    const operation = (document.paths?.[entry.path] as Record<string, Operation> | undefined)?.[entry.method.toLowerCase()];
    if (!operation) throw new Error(`The generated document lacks ${entry.method} ${entry.path}.`);
    const access = entry.meta.access;
    operation.description = [operation.description, accessText(access)].filter(Boolean).join('\n\n');
    if (access.kind === 'signed-in' || access.kind === 'team') operation.security = [{ [sessionScheme]: [] }];
    if (entry.meta.file) {
      // A file answer has no JSON schema: say what it is instead.
      const { mediaType } = entry.meta.file;
      operation.responses = {
        ...operation.responses,
        [String(entry.status)]: {
          description: `The file (${mediaType}), built whole before it is sent; Content-Disposition names it.`,
          content: { [mediaType]: { schema: { type: 'string', contentMediaType: mediaType } } },
        },
      };
    }
    if (entry.meta.upload) {
      // The generator offers JSON beside multipart for a body holding a file; the server reads only multipart.
      const { field, sameAnswerStatus } = entry.meta.upload;
      const multipart = operation.requestBody?.content?.['multipart/form-data'];
      if (!multipart?.schema?.properties?.[field]) throw new Error(`${entry.name}: the generated document lacks the multipart part ${field}.`);
      multipart.schema.properties[field] = {
        type: 'string',
        format: 'binary',
        contentMediaType: 'application/octet-stream',
        description: 'The file: CSV, TSV or semicolon-separated UTF-8 text (413 when it is larger than the limit).',
      };
      operation.requestBody!.content = { 'multipart/form-data': multipart };
      const ok = operation.responses?.[String(entry.status)] as { description?: string } | undefined;
      if (sameAnswerStatus && ok) {
        operation.responses = { ...operation.responses, [String(sameAnswerStatus)]: { ...ok, description: 'Already there: the same file, read the same way, is answered as stored before.' } };
      }
    }
    operation.responses = { ...operation.responses, '4XX': errorResponse('Refused: the error shape names the reason and any bad fields.'), '5XX': errorResponse('Unexpected failure (no detail is given).') };
  }
  return document;
}

/** `GET /api/openapi.json`, built on first request and then served from memory. */
export function openApiRoute(version: string): Implementation<typeof Contract.platform.openapi> {
  let document: Promise<Document> | undefined;
  return async () => (await (document ??= buildOpenApiDocument(version))) as unknown as { openapi: string; paths: Record<string, unknown> };
}
