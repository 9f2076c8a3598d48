export { OrderSortingCard, type OrderSortingCardProps } from './components/order-sorting-card';
