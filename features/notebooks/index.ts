export { CompareScreen } from './components/compare-screen';
export { MarkdownView } from './components/markdown-view';
export { NotebookListScreen, NotebooksHomeScreen } from './components/notebook-list-screen';
export { NotebookScreen } from './components/notebook-screen';
export { ShareScreen } from './components/share-screen';
