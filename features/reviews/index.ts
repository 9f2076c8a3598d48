export { ReviewPanel } from './components/review-panel';
export { useReviewsQuery } from './queries';
