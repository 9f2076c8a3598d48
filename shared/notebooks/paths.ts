/** Route paths, for the client's typed API and the access matrix. */
export const notebookPaths = {
  teamDesigns: (teamId: string) => `/api/teams/${encodeURIComponent(teamId)}/designs`,
  importInto: (teamId: string) => `/api/teams/${encodeURIComponent(teamId)}/designs/import`,
  design: (id: string) => `/api/designs/${encodeURIComponent(id)}`,
  versions: (id: string) => `/api/designs/${encodeURIComponent(id)}/versions`,
  version: (id: string, n: number) => `/api/designs/${encodeURIComponent(id)}/versions/${n}`,
  compare: (id: string, a: number, b: number) =>
    `/api/designs/${encodeURIComponent(id)}/compare?a=${a}&b=${b}`,
  clone: (id: string) => `/api/designs/${encodeURIComponent(id)}/clone`,
  baseline: (id: string) => `/api/designs/${encodeURIComponent(id)}/baseline`,
  shareLinks: (id: string) => `/api/designs/${encodeURIComponent(id)}/share-links`,
  shareLink: (id: string, linkId: string) =>
    `/api/designs/${encodeURIComponent(id)}/share-links/${encodeURIComponent(linkId)}`,
  exportFile: (id: string) => `/api/designs/${encodeURIComponent(id)}/export`,
  shared: (token: string) => `/api/share/${encodeURIComponent(token)}`,
} as const;
