export { ReviewPanel } from './components/review-panel';
export { reviewKeys, useReviewsQuery } from './queries';
