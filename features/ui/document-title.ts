/** Native apps have no document title: each screen's own heading says where you are. */
export function useDocumentTitle(_place: string): void {}
