/**
 * Design notebooks: a design's life as numbered, immutable versions with notes. Requests,
 * responses and the export file format, shared by the server (which parses requests with them)
 * and the client (which parses responses with them). Later changes are additive only.
 *
 * One file per resource; import from this index (`@/shared/notebooks`), not from the files.
 */
export * from './fields';
export { maxVersionNumber, versionNumberSchema } from './version-number';
export * from './versions';
export * from './designs';
export {
  designParamsSchema,
  shareLinkParamsSchema,
  shareTokenParamsSchema,
  teamDesignsParamsSchema,
  versionParamsSchema,
} from './params';
export * from './list-query';
export * from './save-version';
export * from './compare';
export * from './clone';
export * from './baseline';
export * from './share-links';
export * from './notebook-file';
