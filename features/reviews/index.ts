export { ReviewSheet, ReviewSidePanel, type ReviewFocus, type ReviewPanelProps } from './components/review-panel';
export { carryLine, formatPinnedValue } from './carry';
export { useVersionReviewQuery, versionReviewKey } from './thread-queries';
export { DecisionSection } from './components/decision-section';
export { ReviewStateBadge } from './components/review-state-badge';
export { useReviewStatesQuery } from './decision-queries';
