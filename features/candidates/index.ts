export { CandidateSearchPanel, type CandidateSearchPanelProps } from './components/candidate-search-panel';
