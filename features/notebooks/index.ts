export { CompareScreen } from './components/compare-screen';
export { MarkdownView } from './components/markdown-view';
export { openableHref, parseMarkdown, type Inline } from './markdown';
export { NotebookListScreen } from './components/notebook-list-screen';
export { NotebookScreen } from './components/notebook-screen';
export { NotebooksHomeScreen } from './components/notebooks-home-screen';
export { SAVE_TO_NOTEBOOK_KEY, SaveToNotebook } from './components/save-to-notebook';
export { ShareScreen } from './components/share-screen';
