export { SelectorsScreen } from './components/selectors-screen';
export { TradeStudyCard, type TradeStudyCardProps } from './components/trade-study-card';
